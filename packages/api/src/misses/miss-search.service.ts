import { Injectable } from '@nestjs/common';
import { InjectConnection, InjectModel } from '@nestjs/sequelize';
import { literal, Op, type CountOptions, type Order, type WhereOptions } from 'sequelize';
import type { Sequelize } from 'sequelize-typescript';
import { RULE_GROUPS } from '@workback/core';
import type { MemberContext } from '../common/member-context.js';
import { fieldsError } from '../common/pipes/validation.pipe.js';
import { PhotosService } from '../photos/photos.service.js';
import { StudentsService } from '../students/students.service.js';
import { CountCache } from './count-cache.js';
import type { ListMissesQuery } from './dto/list-misses.query.js';
import { fromRawRow, SUMMARY_ATTRIBUTES, toMissSummary, type RawMissRow } from './miss-json.js';
import { missScope } from './miss-scope.js';
import { Miss } from './models/miss.model.js';
import { PageCache } from './page-cache.js';

/** The notebook's list: filters, text search, sort and pages, with a cached count. */
@Injectable()
export class MissSearchService {
  constructor(
    @InjectModel(Miss) private readonly missModel: typeof Miss,
    @InjectConnection() private readonly sequelize: Sequelize,
    private readonly students: StudentsService,
    private readonly photos: PhotosService,
    private readonly counts: CountCache,
    private readonly pages: PageCache,
  ) {}

  async findAll(member: MemberContext, query: ListMissesQuery) {
    if (query.studentId !== undefined) await this.students.findModel(member, query.studentId);
    if (query.from && query.to && query.from > query.to) {
      throw fieldsError({ to: 'to must be on or after from' });
    }
    const key = JSON.stringify([member.studentIds, query]);
    return this.pages.page(member.householdId, key, () => this.readPage(member, query));
  }

  private async readPage(member: MemberContext, query: ListMissesQuery) {
    const page = query.page ?? 1;
    const pageSize = query.pageSize ?? 25;
    const { where, bind } = this.listWhere(member, query);
    const offset = (page - 1) * pageSize;
    // Plain rows, not model instances: a page is read, never saved.
    const found = (await this.missModel.findAll({
      attributes: [...SUMMARY_ATTRIBUTES],
      where,
      order: sortOrder(query.sort ?? '-occurredOn'),
      limit: pageSize,
      offset,
      raw: true,
      bind,
    })) as unknown as RawMissRow[];
    const rows = found.map(fromRawRow);
    // A short page (or an empty first one) already says how many there are; counting a big
    // notebook is the costliest part of a list, so a full page's count is kept a few seconds.
    const known = rows.length < pageSize && (rows.length > 0 || page === 1);
    const total = known
      ? offset + rows.length
      : await this.counts.count(member.householdId, countKey(member, query), () =>
          // CountOptions does not declare `bind`, but count passes its options to the query.
          this.missModel.count({ where, bind } as CountOptions<Miss>),
        );
    const thumbs = await this.photos.thumbnails(rows.map((r) => r.id));
    const items = rows.map((m) => ({
      ...toMissSummary(m),
      thumbnailPhotoId: thumbs.get(m.id)?.id ?? null,
      photoCount: thumbs.get(m.id)?.count ?? 0,
    }));
    return { items, total, page, pageSize };
  }

  /**
   * The list's conditions. Text from the query goes to SQL as bound parameters (`$rule`, …),
   * never written into the SQL, so pass `bind` with `where` to every query that uses it.
   */
  private listWhere(
    member: MemberContext,
    q: ListMissesQuery,
  ): { where: WhereOptions<Miss>; bind: Record<string, string | number> } {
    const and: WhereOptions<Miss>[] = [missScope(member)];
    if (q.studentId !== undefined) and.push({ studentId: q.studentId });
    if (q.cause) and.push({ cause: q.cause });
    if (q.status) and.push({ status: q.status });
    if (q.kind) and.push({ kind: q.kind });
    if (q.stage) and.push({ stage: q.stage });
    if (q.from) and.push({ occurredOn: { [Op.gte]: q.from } });
    if (q.to) and.push({ occurredOn: { [Op.lte]: q.to } });
    const bind: Record<string, string | number> = {};
    const param = (name: string, value: string | number) => {
      bind[name] = value;
      return `$${name}`;
    };
    if (q.rule) {
      // `group:zero-regrouping` is the family of related rules a Patterns card gathers.
      const family = RULE_GROUPS.find((g) => `group:${g.group}` === q.rule);
      const rules = (family ? family.ruleIds : [q.rule])
        .map((id, i) => param(`rule${i}`, id))
        .join(', ');
      and.push({
        id: {
          [Op.in]: literal(
            `(SELECT miss_id FROM miss_rules WHERE household_id = ${param('household', member.householdId)} AND rule_id IN (${rules}))`,
          ),
        },
      });
    }
    const postgres = this.sequelize.getDialect() === 'postgres';
    if (q.skill) {
      // `skills` is a JSON array in a text column on both databases.
      const elements = postgres
        ? `jsonb_array_elements_text("Miss"."skills"::jsonb) AS skill(value)`
        : `json_each("Miss"."skills") AS skill`;
      and.push(
        literal(
          `EXISTS (SELECT 1 FROM ${elements} WHERE skill.value = ${param('skill', q.skill)})`,
        ) as unknown as WhereOptions<Miss>,
      );
    }
    const text = q.q?.trim();
    if (text) {
      // The words may be the problem's, the explanation's or a skill's (the key CSV's words).
      and.push({
        [Op.or]: [
          postgres
            ? likeCondition('ILIKE', text, param)
            : textCondition(text, member.householdId, param),
          skillsCondition(postgres, text, param),
        ],
      } as WhereOptions<Miss>);
    }
    return { where: { [Op.and]: and }, bind };
  }
}

/**
 * Problem or explanation containing `text`, any case. From three characters on, the trigram
 * index finds the rows: its rowids are `(household_id << 32) + id` (migration 0014), so the
 * household's range is all it reads, however many other households match. Shorter text has no
 * trigram and scans the household's misses.
 */
type Param = (name: string, value: string | number) => string;

function textCondition(text: string, householdId: number, param: Param): WhereOptions<Miss> {
  if ([...text].length >= 3) {
    const phrase = `"${text.replace(/"/g, '""')}"`;
    const first = `(${param('household', householdId)} << 32)`;
    return {
      id: {
        [Op.in]: literal(
          `(SELECT rowid - ${first} FROM misses_search WHERE misses_search MATCH ${param('phrase', phrase)} AND rowid BETWEEN ${first} AND ${first} + 4294967295)`,
        ),
      },
    };
  }
  return likeCondition('LIKE', text, param);
}

/**
 * Problem or explanation containing `text` by (I)LIKE: SQLite's LIKE ignores ASCII case, and on
 * PostgreSQL ILIKE uses the pg_trgm indexes of migration 0006 from three characters on.
 */
function likeCondition(operator: 'LIKE' | 'ILIKE', text: string, param: Param): WhereOptions<Miss> {
  const pattern = likePattern(text, param);
  return literal(
    `("Miss"."problem" ${operator} ${pattern} ESCAPE '\\' OR "Miss"."explanation" ${operator} ${pattern} ESCAPE '\\')`,
  ) as unknown as WhereOptions<Miss>;
}

/**
 * A skill of the miss containing `text`, any case. `skills` is a JSON array in a text column; each
 * element is compared, not the JSON text, so quotes and commas of the array never match. It is
 * checked on the rows the other conditions keep, which are the household's.
 */
function skillsCondition(postgres: boolean, text: string, param: Param): WhereOptions<Miss> {
  const pattern = likePattern(text, param);
  const elements = postgres
    ? `jsonb_array_elements_text("Miss"."skills"::jsonb) AS skill(value)`
    : `json_each("Miss"."skills") AS skill`;
  const operator = postgres ? 'ILIKE' : 'LIKE';
  return literal(
    `EXISTS (SELECT 1 FROM ${elements} WHERE skill.value ${operator} ${pattern} ESCAPE '\\')`,
  ) as unknown as WhereOptions<Miss>;
}

/** `%text%` as a bound (I)LIKE pattern, its own `\`, `%` and `_` taken literally. */
function likePattern(text: string, param: Param): string {
  return param('pattern', `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`);
}

const SORT_COLUMNS: Record<string, string> = {
  occurredOn: 'occurredOn',
  createdAt: 'createdAt',
  updatedAt: 'updatedAt',
  status: 'status',
  cause: 'cause',
  problem: 'problem',
};

function sortOrder(sort: string): Order {
  const desc = sort.startsWith('-');
  const column = SORT_COLUMNS[desc ? sort.slice(1) : sort] ?? 'occurredOn';
  const dir = desc ? 'DESC' : 'ASC';
  return [
    [column, dir],
    ['id', dir],
  ];
}

/** Everything that decides which misses a list counts, but the page. */
function countKey(member: MemberContext, q: ListMissesQuery): string {
  const { studentId, cause, status, kind, stage, from, to, rule, skill } = q;
  return JSON.stringify([
    member.studentIds,
    studentId,
    cause,
    status,
    kind,
    stage,
    from,
    to,
    rule,
    skill,
    q.q?.trim(),
  ]);
}

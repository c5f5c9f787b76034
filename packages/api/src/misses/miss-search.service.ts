import { Injectable } from '@nestjs/common';
import { InjectConnection } from '@nestjs/sequelize';
import type { Sequelize } from 'sequelize-typescript';
import { RULE_GROUPS } from '@workback/core';
import type { MemberContext } from '../common/member-context.js';
import { fieldsError } from '../common/pipes/validation.pipe.js';
import { PhotosService } from '../photos/photos.service.js';
import { StudentsService } from '../students/students.service.js';
import { CountCache } from './count-cache.js';
import type { ListMissesQuery } from './dto/list-misses.query.js';
import { placeholders, selectList, SqlReader, type SqlParam } from '../database/sql-reader.js';
import { fromRawRow, SUMMARY_ATTRIBUTES, toMissSummary, type RawMissRow } from './miss-json.js';
import { missScopeSql } from './miss-scope.js';
import { Miss } from './models/miss.model.js';
import { PageCache } from './page-cache.js';

const SUMMARY_COLUMNS = selectList(Miss, SUMMARY_ATTRIBUTES);

/** The notebook's list: filters, text search, sort and pages, with a cached count. */
@Injectable()
export class MissSearchService {
  constructor(
    private readonly reader: SqlReader,
    @InjectConnection() private readonly sequelize: Sequelize,
    private readonly students: StudentsService,
    private readonly photos: PhotosService,
    private readonly counts: CountCache,
    private readonly pages: PageCache,
  ) {}

  async findAll(member: MemberContext, query: ListMissesQuery) {
    if (query.studentId !== undefined) await this.students.find(member, query.studentId);
    if (query.from && query.to && query.from > query.to) {
      throw fieldsError({ to: 'to must be on or after from' });
    }
    const key = JSON.stringify([member.studentIds, query]);
    return this.pages.page(member.householdId, key, () => this.readPage(member, query));
  }

  private async readPage(member: MemberContext, query: ListMissesQuery) {
    const page = query.page ?? 1;
    const pageSize = query.pageSize ?? 25;
    const where = this.listWhere(member, query);
    const offset = (page - 1) * pageSize;
    // Plain rows through the driver (SqlReader), not model instances: a page is read, never saved.
    const found = await this.reader.rows<RawMissRow>(
      `SELECT ${SUMMARY_COLUMNS()} FROM "misses" AS "m" WHERE ${where.sql}
       ORDER BY ${sortOrder(query.sort ?? '-occurredOn')} LIMIT ? OFFSET ?`,
      [...where.params, pageSize, offset],
    );
    const rows = found.map(fromRawRow);
    // A short page (or an empty first one) already says how many there are; counting a big
    // notebook is the costliest part of a list, so a full page's count is kept a few seconds.
    const known = rows.length < pageSize && (rows.length > 0 || page === 1);
    const total = known
      ? offset + rows.length
      : await this.counts.count(member.householdId, countKey(member, query), async () => {
          const [counted] = await this.reader.rows<{ n: number | string }>(
            `SELECT COUNT(*) AS "n" FROM "misses" AS "m" WHERE ${where.sql}`,
            where.params,
          );
          // PostgreSQL's COUNT is a bigint, which its driver hands back as text.
          return Number(counted!.n);
        });
    const thumbs = await this.photos.thumbnails(rows.map((r) => r.id));
    const items = rows.map((m) => ({
      ...toMissSummary(m),
      thumbnailPhotoId: thumbs.get(m.id)?.id ?? null,
      photoCount: thumbs.get(m.id)?.count ?? 0,
    }));
    return { items, total, page, pageSize };
  }

  /**
   * The list's conditions on `"misses" AS "m"`, as SQL with `?` parameters in order: text from
   * the query is always bound, never written into the SQL.
   */
  private listWhere(member: MemberContext, q: ListMissesQuery): SqlCondition {
    const scope = missScopeSql(member);
    const and: string[] = [scope.sql];
    const params: SqlParam[] = [...scope.params];
    const add = (sql: string, ...values: SqlParam[]) => {
      and.push(sql);
      params.push(...values);
    };
    if (q.studentId !== undefined) add('"m"."student_id" = ?', q.studentId);
    if (q.cause) add('"m"."cause" = ?', q.cause);
    if (q.status) add('"m"."status" = ?', q.status);
    if (q.kind) add('"m"."kind" = ?', q.kind);
    if (q.stage) add('"m"."stage" = ?', q.stage);
    if (q.from) add('"m"."occurred_on" >= ?', q.from);
    if (q.to) add('"m"."occurred_on" <= ?', q.to);
    if (q.rule) {
      // `group:zero-regrouping` is the family of related rules a Patterns card gathers.
      const family = RULE_GROUPS.find((g) => `group:${g.group}` === q.rule);
      const rules = family ? family.ruleIds : [q.rule];
      add(
        `"m"."id" IN (SELECT "miss_id" FROM "miss_rules" WHERE "household_id" = ? AND "rule_id" IN (${placeholders(rules.length)}))`,
        member.householdId,
        ...rules,
      );
    }
    const postgres = this.sequelize.getDialect() === 'postgres';
    if (q.skill) {
      // `skills` is a JSON array in a text column on both databases.
      add(`EXISTS (SELECT 1 FROM ${skillElements(postgres)} WHERE skill.value = ?)`, q.skill);
    }
    const text = q.q?.trim();
    if (text) {
      // The words may be the problem's, the explanation's or a skill's (the key CSV's words).
      const words = postgres
        ? likeCondition('ILIKE', text)
        : textCondition(text, member.householdId);
      const skills = skillsCondition(postgres, text);
      add(`(${words.sql} OR ${skills.sql})`, ...words.params, ...skills.params);
    }
    return { sql: and.map((c) => `(${c})`).join(' AND '), params };
  }
}

/** A condition as SQL with its `?` parameters, in order. */
interface SqlCondition {
  sql: string;
  params: SqlParam[];
}

/** The miss's skills, one row each (`skill.value`): a JSON array in a text column. */
function skillElements(postgres: boolean): string {
  return postgres
    ? `jsonb_array_elements_text("m"."skills"::jsonb) AS skill(value)`
    : `json_each("m"."skills") AS skill`;
}

/**
 * Problem or explanation containing `text`, any case. From three characters on, the trigram
 * index finds the rows: its rowids are `(household_id << 32) + id` (migration 0014), so the
 * household's range is all it reads, however many other households match. Shorter text has no
 * trigram and scans the household's misses.
 */
function textCondition(text: string, householdId: number): SqlCondition {
  if ([...text].length >= 3) {
    // The phrase's own quotes are doubled: FTS5 reads `"…"` as one phrase.
    const phrase = `"${text.replace(/"/g, '""')}"`;
    return {
      sql: `"m"."id" IN (SELECT rowid - (? << 32) FROM misses_search WHERE misses_search MATCH ? AND rowid BETWEEN (? << 32) AND (? << 32) + 4294967295)`,
      params: [householdId, phrase, householdId, householdId],
    };
  }
  return likeCondition('LIKE', text);
}

/**
 * Problem or explanation containing `text` by (I)LIKE: SQLite's LIKE ignores ASCII case, and on
 * PostgreSQL ILIKE uses the pg_trgm indexes of migration 0006 from three characters on.
 */
function likeCondition(operator: 'LIKE' | 'ILIKE', text: string): SqlCondition {
  const pattern = likePattern(text);
  return {
    sql: `"m"."problem" ${operator} ? ESCAPE '\\' OR "m"."explanation" ${operator} ? ESCAPE '\\'`,
    params: [pattern, pattern],
  };
}

/**
 * A skill of the miss containing `text`, any case. Each element of the JSON array is compared,
 * not the JSON text, so quotes and commas of the array never match. It is checked on the rows
 * the other conditions keep, which are the household's.
 */
function skillsCondition(postgres: boolean, text: string): SqlCondition {
  return {
    sql: `EXISTS (SELECT 1 FROM ${skillElements(postgres)} WHERE skill.value ${postgres ? 'ILIKE' : 'LIKE'} ? ESCAPE '\\')`,
    params: [likePattern(text)],
  };
}

/** `%text%` as an (I)LIKE pattern, its own `\`, `%` and `_` taken literally. */
function likePattern(text: string): string {
  return `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

/** The sortable columns (MISS_SORTS), by the name a query gives them. */
const SORT_COLUMNS: Record<string, string> = {
  occurredOn: 'occurred_on',
  createdAt: 'created_at',
  updatedAt: 'updated_at',
  status: 'status',
  cause: 'cause',
  problem: 'problem',
};

/** ORDER BY's terms for `sort` (`-` first for newest or last first), the id breaking ties. */
function sortOrder(sort: string): string {
  const desc = sort.startsWith('-');
  const column = SORT_COLUMNS[desc ? sort.slice(1) : sort] ?? 'occurred_on';
  const dir = desc ? 'DESC' : 'ASC';
  return `"m"."${column}" ${dir}, "m"."id" ${dir}`;
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

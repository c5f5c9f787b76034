import { createHash } from 'node:crypto';
import { ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectConnection, InjectModel } from '@nestjs/sequelize';
import {
  Cause,
  checkLines,
  missKindOf,
  MissStatus,
  suggestStageCause,
  type CheckedLines,
  type Diagnosis,
  type InterviewStage,
  type PatternMiss,
  type WrittenSteps,
} from '@workback/core';
import {
  literal,
  Op,
  UniqueConstraintError,
  type CountOptions,
  type Order,
  type Transaction,
  type WhereOptions,
} from 'sequelize';
import type { Sequelize } from 'sequelize-typescript';
import type { MemberContext } from '../common/member-context.js';
import { fieldsError } from '../common/pipes/validation.pipe.js';
import { DiagnoseService, type Checked } from '../diagnose/diagnose.service.js';
import { MAX_PHOTOS_PER_MISS } from '../photos/photo-limits.js';
import {
  PhotosService,
  type PhotoJson,
  type StagedPhoto,
  type UploadedPhoto,
} from '../photos/photos.service.js';
import { StudentsService } from '../students/students.service.js';
import { MAX_LINE_LENGTH, type CreateMissDto } from './dto/create-miss.dto.js';
import type { ListMissesQuery } from './dto/list-misses.query.js';
import { toPatternMiss } from './pattern-miss.js';
import type { UpdateMissDto } from './dto/update-miss.dto.js';
import { CountCache } from './count-cache.js';
import { missScope } from './miss-scope.js';
import { MissDiagnosis } from './models/miss-diagnosis.model.js';
import { MissRule } from './models/miss-rule.model.js';
import { Miss } from './models/miss.model.js';

/** Links a miss to a sitting's key item; set by the keys and sittings services, not by clients. */
export interface MissLinks {
  sittingId?: number | null;
  keyItemId?: number | null;
}

/** A word problem's number sentences, what checkLines made of them, and the interview stage. */
interface WordProblem {
  lines: string[] | null;
  linesCheck: CheckedLines | null;
  stage: InterviewStage | null;
}

/** A client's Idempotency-Key with the digest of the request it came with. */
interface SentOnce {
  key: string;
  digest: string;
}

@Injectable()
export class MissesService {
  constructor(
    @InjectModel(Miss) private readonly missModel: typeof Miss,
    @InjectModel(MissRule) private readonly ruleModel: typeof MissRule,
    @InjectModel(MissDiagnosis) private readonly diagnosisModel: typeof MissDiagnosis,
    @InjectConnection() private readonly sequelize: Sequelize,
    private readonly students: StudentsService,
    private readonly photos: PhotosService,
    private readonly diagnoser: DiagnoseService,
    private readonly counts: CountCache,
  ) {}

  /**
   * Saves a miss with its photos. Order: check everything in memory (fields, student,
   * photos, diagnosis), write the files, then every row in one transaction; when any
   * step fails the files written are removed, so nothing is left behind.
   */
  async create(
    member: MemberContext,
    dto: CreateMissDto,
    files: readonly UploadedPhoto[] = [],
    links: MissLinks = {},
    once: SentOnce | null = null,
  ) {
    await this.students.findModel(member, dto.studentId);
    if (files.length > MAX_PHOTOS_PER_MISS) {
      throw fieldsError({ photos: `attach at most ${MAX_PHOTOS_PER_MISS} photos` });
    }
    const checked = this.check(dto.problem, dto.answer, dto.steps ?? null);
    const word = this.wordProblem(dto.lines ?? null, dto.stage ?? null);
    const processed = await this.photos.process(files, member);
    const staged = await this.photos.stage(processed);
    try {
      const id = await this.sequelize.transaction(async (transaction) => {
        const miss = await this.missModel.create(
          {
            householdId: member.householdId,
            studentId: dto.studentId,
            occurredOn: dto.occurredOn,
            sittingId: links.sittingId ?? null,
            keyItemId: links.keyItemId ?? null,
            problem: dto.problem,
            answer: dto.answer,
            steps: dto.steps ?? null,
            explanation: dto.explanation ?? '',
            cause: dto.cause ?? Cause.unsure,
            note: dto.note ?? '',
            status: dto.status ?? MissStatus.logged,
            skills: dedupe(dto.skills ?? []),
            revisit: dedupe(dto.revisit ?? []),
            ...diagnosisColumns(checked),
            ...wordProblemColumns(checked, word),
            kind: missKindOf(dto.problem, word),
            idempotencyKey: once?.key ?? null,
            requestDigest: once?.digest ?? null,
            createdBy: member.userId,
            updatedBy: member.userId,
          },
          { transaction },
        );
        await this.writeRules(miss, checked, transaction, word);
        await this.photos.createRows(miss.id, staged, member.userId, transaction);
        return miss.id;
      });
      return this.findOne(member, id);
    } catch (err) {
      await this.photos.discard(staged);
      throw err;
    }
  }

  /**
   * `create` for a request the client may send again (an offline draft, a retry after a lost
   * answer): the same key in this household answers the miss it made (`replayed`); the key
   * sent with other fields or photos is a 409. Two copies racing meet at the unique index.
   */
  async createOnce(
    member: MemberContext,
    dto: CreateMissDto,
    files: readonly UploadedPhoto[],
    key: string,
  ): Promise<{ miss: Awaited<ReturnType<MissesService['findOne']>>; replayed: boolean }> {
    const once = { key, digest: requestDigest(dto, files) };
    const earlier = await this.findSentOnce(member, once);
    if (earlier) return { miss: earlier, replayed: true };
    try {
      return { miss: await this.create(member, dto, files, {}, once), replayed: false };
    } catch (err) {
      if (!(err instanceof UniqueConstraintError)) throw err;
      const raced = await this.findSentOnce(member, once);
      if (!raced) throw err;
      return { miss: raced, replayed: true };
    }
  }

  private async findSentOnce(member: MemberContext, once: SentOnce) {
    const miss = await this.missModel.findOne({
      attributes: ['id', 'requestDigest'],
      where: { householdId: member.householdId, idempotencyKey: once.key },
    });
    if (!miss) return null;
    if (miss.requestDigest !== once.digest) {
      throw new ConflictException({
        message:
          'This Idempotency-Key was already used for a different miss; send a new key for new content.',
        fields: { 'idempotency-key': 'already used for a different miss' },
      });
    }
    return this.findOne(member, miss.id);
  }

  async addPhotos(member: MemberContext, id: number, files: readonly UploadedPhoto[]) {
    const miss = await this.findModel(member, id);
    if (files.length === 0) throw fieldsError({ photos: 'attach 1 to 4 photos' });
    const processed = await this.photos.process(files, member);
    let staged: StagedPhoto[] = [];
    try {
      staged = await this.photos.stage(processed);
      await this.sequelize.transaction(async (transaction) => {
        const have = await this.photos.countFor(miss.id, transaction);
        if (have + staged.length > MAX_PHOTOS_PER_MISS) {
          throw fieldsError({
            photos: `a miss holds at most ${MAX_PHOTOS_PER_MISS} photos; this one has ${have}`,
          });
        }
        await this.photos.createRows(miss.id, staged, member.userId, transaction);
        await miss.update({ updatedBy: member.userId }, { transaction });
      });
    } catch (err) {
      await this.photos.discard(staged);
      throw err;
    }
    return this.findOne(member, id);
  }

  async findAll(member: MemberContext, query: ListMissesQuery) {
    if (query.studentId !== undefined) await this.students.findModel(member, query.studentId);
    if (query.from && query.to && query.from > query.to) {
      throw fieldsError({ to: 'to must be on or after from' });
    }
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

  async findOne(member: MemberContext, id: number) {
    const miss = await this.findModel(member, id);
    const photos = (await this.photos.forMisses([miss.id])).get(miss.id) ?? [];
    const found = await this.diagnosisModel.findByPk(miss.id);
    return { ...toMissJson(miss, photos, found?.diagnosis ?? null), linesCheck: miss.linesCheck };
  }

  /** 404 both for what does not exist and for what is not this member's to see. */
  async findModel(member: MemberContext, id: number, transaction?: Transaction): Promise<Miss> {
    const miss = await this.missModel.findOne({
      where: { [Op.and]: [missScope(member), { id }] },
      transaction,
    });
    if (!miss) throw new NotFoundException(`No miss ${id} in this household`);
    return miss;
  }

  async update(member: MemberContext, id: number, dto: UpdateMissDto) {
    const miss = await this.findModel(member, id);
    if (dto.studentId !== undefined && dto.studentId !== miss.studentId) {
      await this.students.findModel(member, dto.studentId);
    }
    const changes: Partial<Miss> = {};
    for (const key of [
      'studentId',
      'occurredOn',
      'problem',
      'answer',
      'explanation',
      'cause',
      'note',
      'status',
    ] as const) {
      if (dto[key] !== undefined) (changes as Record<string, unknown>)[key] = dto[key];
    }
    if (dto.skills !== undefined) changes.skills = dedupe(dto.skills);
    if (dto.revisit !== undefined) changes.revisit = dedupe(dto.revisit);
    if (dto.steps !== undefined) changes.steps = dto.steps;
    const wordChanged = dto.lines !== undefined || dto.stage !== undefined;
    const rediagnose =
      (dto.problem !== undefined && dto.problem !== miss.problem) ||
      (dto.answer !== undefined && dto.answer !== miss.answer) ||
      dto.steps !== undefined ||
      wordChanged;
    const word = rediagnose
      ? this.wordProblem(
          dto.lines === undefined ? miss.lines : dto.lines,
          dto.stage === undefined ? miss.stage : dto.stage,
        )
      : null;
    const checked = rediagnose
      ? this.check(
          changes.problem ?? miss.problem,
          changes.answer ?? miss.answer,
          dto.steps === undefined ? miss.steps : dto.steps,
        )
      : null;
    await this.sequelize.transaction(async (transaction) => {
      await miss.update(
        {
          ...changes,
          ...(checked && word
            ? {
                ...diagnosisColumns(checked),
                ...wordProblemColumns(checked, word),
                kind: missKindOf(changes.problem ?? miss.problem, word),
              }
            : {}),
          updatedBy: member.userId,
        },
        { transaction },
      );
      if (checked && word) await this.writeRules(miss, checked, transaction, word);
    });
    return this.findOne(member, id);
  }

  /** Status changes made by other services (a review plan marks its misses planned). */
  async setStatus(
    member: MemberContext,
    ids: readonly number[],
    status: MissStatus,
    transaction?: Transaction,
  ): Promise<number> {
    const [count] = await this.missModel.update(
      { status, updatedBy: member.userId },
      { where: { [Op.and]: [missScope(member), { id: { [Op.in]: ids } }] }, transaction },
    );
    return count;
  }

  /**
   * For the patterns and review-plans modules: one student's misses with their full
   * diagnoses, oldest first, filtered by day range, status or ids (all scoped to the member).
   */
  async withDiagnoses(
    member: MemberContext,
    filter: {
      studentId: number;
      from?: string;
      to?: string;
      statuses?: readonly MissStatus[];
      ids?: readonly number[];
    },
    transaction?: Transaction,
  ) {
    const and: WhereOptions<Miss>[] = [missScope(member), { studentId: filter.studentId }];
    if (filter.from) and.push({ occurredOn: { [Op.gte]: filter.from } });
    if (filter.to) and.push({ occurredOn: { [Op.lte]: filter.to } });
    if (filter.statuses) and.push({ status: { [Op.in]: [...filter.statuses] } });
    if (filter.ids) and.push({ id: { [Op.in]: [...filter.ids] } });
    const rows = await this.missModel.findAll({
      where: { [Op.and]: and },
      order: [
        ['occurredOn', 'ASC'],
        ['id', 'ASC'],
      ],
      transaction,
    });
    const diagnoses = new Map(
      (
        await this.diagnosisModel.findAll({
          where: { missId: { [Op.in]: rows.map((r) => r.id) } },
          transaction,
        })
      ).map((d) => [d.missId, d.diagnosis]),
    );
    return rows.map((m) => ({
      ...toMissSummary(m),
      linesCheck: m.linesCheck,
      diagnosis: diagnoses.get(m.id) ?? null,
    }));
  }

  /**
   * One student's misses as the pattern maths reads them, from the row's own columns: the
   * rule ids (a pair's `id` joins its `ids` with `+`) and facts, without the stored diagnosis.
   */
  async patternMisses(
    member: MemberContext,
    filter: { studentId: number; from?: string; to?: string },
  ): Promise<PatternMiss[]> {
    const and: WhereOptions<Miss>[] = [missScope(member), { studentId: filter.studentId }];
    if (filter.from) and.push({ occurredOn: { [Op.gte]: filter.from } });
    if (filter.to) and.push({ occurredOn: { [Op.lte]: filter.to } });
    const rows = await this.missModel.findAll({
      attributes: [
        'id',
        'occurredOn',
        'cause',
        'skills',
        'problem',
        'answer',
        'notCheckedReason',
        'ruleIds',
        'facts',
        'lines',
      ],
      where: { [Op.and]: and },
      order: [
        ['occurredOn', 'ASC'],
        ['id', 'ASC'],
      ],
    });
    return rows.map((m) =>
      toPatternMiss(
        m,
        // A word problem the engine cannot read counts its first wrong line's rules.
        m.notCheckedReason === null || m.lines !== null
          ? { rules: m.ruleIds.map((id) => ({ id, ids: id.split('+') })), facts: m.facts }
          : null,
      ),
    );
  }

  async remove(member: MemberContext, id: number): Promise<void> {
    const keys = await this.sequelize.transaction(async (transaction) => {
      const miss = await this.findModel(member, id, transaction);
      const found = await this.photos.keysOfMiss(miss.id, transaction);
      await miss.destroy({ transaction });
      return found;
    });
    await this.photos.removeKeys(keys);
  }

  // ── Misses made from a sitting's marks (called by the sittings module, inside its transaction) ──

  /** The misses made from one sitting's marks, by key item. */
  async findForSitting(
    sittingId: number,
    transaction?: Transaction,
  ): Promise<Map<number, { id: number; status: MissStatus }>> {
    const rows = await this.missModel.findAll({
      where: { sittingId, keyItemId: { [Op.ne]: null } },
      attributes: ['id', 'keyItemId', 'status'],
      transaction,
    });
    return new Map(rows.map((m) => [m.keyItemId!, { id: m.id, status: m.status }]));
  }

  /** One miss for a wrong item: the item's prompt, the child's answer, the key's skills and lessons. */
  async createFromMark(
    member: MemberContext,
    input: {
      studentId: number;
      occurredOn: string;
      problem: string;
      answer: string;
      skills: readonly string[];
      revisit: readonly string[];
      sittingId: number;
      keyItemId: number;
      cause?: Cause;
    },
    transaction: Transaction,
  ): Promise<number> {
    const checked = this.diagnoser.check(input.problem, input.answer, null);
    const miss = await this.missModel.create(
      {
        householdId: member.householdId,
        studentId: input.studentId,
        occurredOn: input.occurredOn,
        sittingId: input.sittingId,
        keyItemId: input.keyItemId,
        problem: input.problem,
        answer: input.answer,
        steps: null,
        explanation: '',
        cause: input.cause ?? Cause.unsure,
        note: '',
        status: MissStatus.logged,
        skills: dedupe(input.skills),
        revisit: dedupe(input.revisit),
        ...diagnosisColumns(checked),
        kind: missKindOf(input.problem),
        createdBy: member.userId,
        updatedBy: member.userId,
      },
      { transaction },
    );
    await this.writeRules(miss, checked, transaction);
    return miss.id;
  }

  /** The item is wrong again: the miss is open again (logged), with the answer now written. */
  async reopenFromMark(
    member: MemberContext,
    id: number,
    answer: string,
    transaction: Transaction,
  ) {
    const miss = await this.findModel(member, id, transaction);
    await this.answerFromMark(member, id, answer, transaction);
    await miss.reload({ transaction });
    await miss.update({ status: MissStatus.logged, updatedBy: member.userId }, { transaction });
  }

  /** The child's answer for the item was changed on the marks: the miss takes it, re-diagnosed. */
  async answerFromMark(
    member: MemberContext,
    id: number,
    answer: string,
    transaction: Transaction,
  ) {
    const miss = await this.findModel(member, id, transaction);
    if (miss.answer === answer) return;
    const checked = this.diagnoser.check(miss.problem, answer, miss.steps);
    const word = { lines: miss.lines, linesCheck: miss.linesCheck, stage: miss.stage };
    await miss.update(
      {
        answer,
        ...diagnosisColumns(checked),
        ...wordProblemColumns(checked, word),
        updatedBy: member.userId,
      },
      { transaction },
    );
    await this.writeRules(miss, checked, transaction, word);
  }

  /** The item's mark turned right: resolved, the reason added to the note. */
  async resolveFromMark(
    member: MemberContext,
    id: number,
    reason: string,
    transaction: Transaction,
  ) {
    const miss = await this.findModel(member, id, transaction);
    const line = `Resolved: ${reason}`.slice(0, 500);
    await miss.update(
      {
        status: MissStatus.resolved,
        note: miss.note ? `${miss.note}\n${line}` : line,
        updatedBy: member.userId,
      },
      { transaction },
    );
  }

  // ── end of the sittings section ──

  private check(problem: string, answer: string, steps: WrittenSteps | null): Checked {
    const checked = this.diagnoser.check(problem, answer, steps);
    // Steps are structured input: if the engine cannot read them the request is wrong, not the problem.
    if (!checked.checked && checked.part === 'steps') throw fieldsError({ steps: checked.reason });
    return checked;
  }

  /**
   * A word problem's lines checked one by one (null when there are none). A line the engine
   * cannot read is refused like unreadable steps, naming it (`lines.2` is the third line);
   * an engine failure keeps the lines unchecked rather than losing the entry.
   */
  private wordProblem(lines: string[] | null, stage: InterviewStage | null): WordProblem {
    if (!lines || lines.length === 0) return { lines: null, linesCheck: null, stage };
    const long = lines.findIndex((l) => [...l].length > MAX_LINE_LENGTH);
    if (long >= 0) {
      throw fieldsError({
        [`lines.${long}`]: `line ${long + 1} must be at most ${MAX_LINE_LENGTH} characters`,
      });
    }
    let linesCheck: CheckedLines;
    try {
      linesCheck = checkLines(lines);
    } catch {
      return { lines, linesCheck: null, stage };
    }
    if (!linesCheck.ok) {
      throw fieldsError({ [`lines.${linesCheck.line - 1}`]: linesCheck.error.message });
    }
    return { lines, linesCheck, stage };
  }

  /** The diagnosis row and the rule rows of a miss, replaced by the new findings. */
  private async writeRules(
    miss: Miss,
    checked: Checked,
    transaction: Transaction,
    word: WordProblem | null = null,
  ) {
    await this.diagnosisModel.destroy({ where: { missId: miss.id }, transaction });
    if (checked.checked) {
      await this.diagnosisModel.create(
        { missId: miss.id, diagnosis: checked.diagnosis },
        { transaction },
      );
    }
    await this.ruleModel.destroy({ where: { missId: miss.id }, transaction });
    const counted = checked.checked ? checked.diagnosis : firstWrongLine(word?.linesCheck ?? null);
    const ids = counted ? ruleIdsOf(counted) : [];
    if (ids.length === 0) return;
    await this.ruleModel.bulkCreate(
      ids.map((ruleId) => ({ missId: miss.id, ruleId, householdId: miss.householdId })),
      { transaction },
    );
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
      and.push({
        id: {
          [Op.in]: literal(
            `(SELECT miss_id FROM miss_rules WHERE household_id = ${param('household', member.householdId)} AND rule_id = ${param('rule', q.rule)})`,
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
      and.push(
        postgres
          ? likeCondition('ILIKE', text, param)
          : textCondition(text, member.householdId, param),
      );
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
  const pattern = param('pattern', `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`);
  return literal(
    `("Miss"."problem" ${operator} ${pattern} ESCAPE '\\' OR "Miss"."explanation" ${operator} ${pattern} ESCAPE '\\')`,
  ) as unknown as WhereOptions<Miss>;
}

/** SHA-256 over the validated fields (in a fixed order) and every photo's bytes. */
function requestDigest(dto: CreateMissDto, files: readonly UploadedPhoto[]): string {
  const hash = createHash('sha256');
  hash.update(
    JSON.stringify([
      dto.studentId,
      dto.occurredOn,
      dto.problem,
      dto.answer,
      dto.steps ?? null,
      dto.explanation ?? '',
      dto.cause ?? null,
      dto.note ?? '',
      dto.status ?? null,
      dto.skills ?? [],
      dto.revisit ?? [],
      // Only when sent, so a key used before word problems existed keeps its digest.
      ...(dto.lines !== undefined || dto.stage !== undefined
        ? [dto.lines ?? [], dto.stage ?? null]
        : []),
    ]),
  );
  for (const file of files) {
    hash.update(`\0${file.buffer.length}\0`);
    hash.update(file.buffer);
  }
  return hash.digest('hex');
}

function diagnosisColumns(checked: Checked) {
  if (!checked.checked) {
    return {
      engineVersion: null,
      notCheckedReason: checked.reason,
      expected: null,
      correct: null,
      ruleIds: [],
      facts: [],
      suggestedCause: null,
    };
  }
  const d = checked.diagnosis;
  return {
    engineVersion: d.engineVersion,
    notCheckedReason: null,
    expected: d.expected,
    correct: d.correct,
    ruleIds: d.rules.map((r) => r.id),
    facts: d.facts,
    suggestedCause: d.suggestedCause?.cause ?? null,
  };
}

/** The diagnosis of a word problem's first wrong line, or null when every line is right. */
function firstWrongLine(check: CheckedLines | null): Diagnosis | null {
  if (!check?.ok || check.firstWrongLine === null) return null;
  return check.lines[check.firstWrongLine - 1]?.diagnosis ?? null;
}

/**
 * A word problem's columns. When the engine cannot read the problem itself, its first wrong
 * line's rules and facts stand for the miss (so patterns count them). The interview stage
 * feeds the suggested cause (after Newman 1977; White 2005 for the practice): reading →
 * reading, process → the working's own cause (the first wrong line's for a word problem),
 * encoding → copying, comprehension and transformation → concept.
 */
function wordProblemColumns(checked: Checked, word: WordProblem) {
  const line = checked.checked ? null : firstWrongLine(word.linesCheck);
  const working = checked.checked ? checked.diagnosis : line;
  const ownCause = working?.suggestedCause?.cause ?? null;
  return {
    lines: word.lines,
    linesCheck: word.linesCheck,
    stage: word.stage,
    ...(line ? { ruleIds: line.rules.map((r) => r.id), facts: line.facts } : {}),
    suggestedCause: word.stage
      ? (suggestStageCause(word.stage, working?.suggestedCause ?? null)?.cause ?? null)
      : ownCause,
  };
}

/** Every rule id a diagnosis names, each id of a pair included. */
function ruleIdsOf(d: Diagnosis): string[] {
  return dedupe(d.rules.flatMap((r) => [...r.ids]));
}

function dedupe(list: readonly string[]): string[] {
  return [...new Set(list)];
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

/** A row of the notebook: everything but the full diagnosis. */
/** The columns a notebook page shows (toMissSummary). */
const SUMMARY_ATTRIBUTES = [
  'id',
  'studentId',
  'occurredOn',
  'sittingId',
  'keyItemId',
  'problem',
  'answer',
  'steps',
  'explanation',
  'cause',
  'note',
  'status',
  'skills',
  'revisit',
  'lines',
  'stage',
  'kind',
  'notCheckedReason',
  'expected',
  'correct',
  'ruleIds',
  'suggestedCause',
  'engineVersion',
  'createdBy',
  'updatedBy',
  'createdAt',
  'updatedAt',
] as const satisfies readonly (keyof Miss)[];

type SummaryFields = Pick<Miss, (typeof SUMMARY_ATTRIBUTES)[number]>;
type RawMissRow = Record<(typeof SUMMARY_ATTRIBUTES)[number], unknown>;

/**
 * A raw row as the model would read it: JSON text parsed, SQLite's 0/1 as a boolean and its
 * date text ('2026-12-03 13:36:39.111 +00:00') as a Date. PostgreSQL's driver hands back
 * booleans and Dates already.
 */
function fromRawRow(r: RawMissRow): SummaryFields {
  const json = <T>(v: unknown, fallback: T): T =>
    typeof v === 'string' ? (JSON.parse(v) as T) : ((v as T | null) ?? fallback);
  const date = (v: unknown): Date =>
    v instanceof Date ? v : new Date(String(v).replace(' ', 'T').replace(' ', ''));
  return {
    ...(r as unknown as SummaryFields),
    steps: json(r.steps, null),
    skills: json(r.skills, []),
    revisit: json(r.revisit, []),
    lines: json(r.lines, null),
    ruleIds: json(r.ruleIds, []),
    correct: r.correct === null ? null : Boolean(r.correct),
    createdAt: date(r.createdAt),
    updatedAt: date(r.updatedAt),
  };
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

export function toMissSummary(m: SummaryFields) {
  return {
    id: m.id,
    studentId: m.studentId,
    occurredOn: m.occurredOn,
    sittingId: m.sittingId,
    keyItemId: m.keyItemId,
    problem: m.problem,
    answer: m.answer,
    steps: m.steps,
    explanation: m.explanation,
    cause: m.cause,
    note: m.note,
    status: m.status,
    skills: m.skills,
    revisit: m.revisit,
    lines: m.lines,
    stage: m.stage,
    kind: m.kind,
    checked: m.notCheckedReason === null,
    notCheckedReason: m.notCheckedReason,
    expected: m.expected,
    correct: m.correct,
    ruleIds: m.ruleIds,
    suggestedCause: m.suggestedCause,
    engineVersion: m.engineVersion,
    createdBy: m.createdBy,
    updatedBy: m.updatedBy,
    createdAt: m.createdAt,
    updatedAt: m.updatedAt,
  };
}

export function toMissJson(m: Miss, photos: PhotoJson[], diagnosis: Diagnosis | null) {
  return {
    ...toMissSummary(m),
    diagnosis,
    photos,
    thumbnailPhotoId: photos[0]?.id ?? null,
    photoCount: photos.length,
  };
}

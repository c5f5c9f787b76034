import { ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectConnection, InjectModel } from '@nestjs/sequelize';
import { Cause, missKindOf, MissStatus } from '@workback/core';
import { Op, UniqueConstraintError, type Transaction } from 'sequelize';
import type { Sequelize } from 'sequelize-typescript';
import type { MemberContext } from '../common/member-context.js';
import { fieldsError } from '../common/pipes/validation.pipe.js';
import { InsertsService } from '../database/inserts.service.js';
import { type FindLock, lockIf } from '../database/row-lock.js';
import { selectList, SqlReader } from '../database/sql-reader.js';
import { MAX_PHOTOS_PER_MISS } from '../photos/photo-limits.js';
import { PhotosService, type UploadedPhoto } from '../photos/photos.service.js';
import { StudentsService } from '../students/students.service.js';
import type { CreateMissDto } from './dto/create-miss.dto.js';
import type { UpdateMissDto } from './dto/update-miss.dto.js';
import { dedupe, diagnosisColumns, wordProblemColumns } from './miss-columns.js';
import { MissDiagnosesService } from './miss-diagnoses.service.js';
import {
  fromRawRow,
  jsonOf,
  SUMMARY_ATTRIBUTES,
  toMissJson,
  type RawMissRow,
} from './miss-json.js';
import { missScope, missScopeSql } from './miss-scope.js';
import { Miss } from './models/miss.model.js';
import { requestDigest } from './request-digest.js';

/** The columns an opened miss shows, as SqlReader reads them. */
const OPEN_COLUMNS = selectList(Miss, [...SUMMARY_ATTRIBUTES, 'linesCheck']);

/** Links a miss to a sitting's key item; set by the keys and sittings services, not by clients. */
export interface MissLinks {
  sittingId?: number | null;
  keyItemId?: number | null;
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
    @InjectConnection() private readonly sequelize: Sequelize,
    private readonly students: StudentsService,
    private readonly photos: PhotosService,
    private readonly diagnoses: MissDiagnosesService,
    private readonly reader: SqlReader,
    private readonly inserts: InsertsService,
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
    if (files.length > MAX_PHOTOS_PER_MISS) {
      throw fieldsError({ photos: `attach at most ${MAX_PHOTOS_PER_MISS} photos` });
    }
    const checked = this.diagnoses.check(dto.problem, dto.answer, dto.steps ?? null);
    const word = this.diagnoses.wordProblem(dto.lines ?? null, dto.stage ?? null);
    // The student is looked up while the photos are re-encoded, not before: under load each
    // read waits 10–40 ms for a turn of the event loop. A student not in the household is
    // still the answer (404) when the photos are refused too.
    const [student, photos] = await Promise.allSettled([
      this.students.find(member, dto.studentId),
      this.photos.process(files, member),
    ]);
    if (student.status === 'rejected') throw student.reason;
    if (photos.status === 'rejected') throw photos.reason;
    const processed = photos.value;
    const staged = await this.photos.stage(processed);
    try {
      // The miss with its diagnosis, rule and photo rows, written together (InsertsService).
      const id = await this.inserts.withNewId(Miss, (id) => [
        {
          model: Miss,
          values: [
            {
              id,
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
          ],
        },
        ...this.diagnoses.newRows(id, member.householdId, checked, word),
        this.photos.newRows(id, staged, member.userId),
      ]);
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

  async findOne(member: MemberContext, id: number) {
    // A plain row through the driver (SqlReader), not a model: opening a miss reads it, never
    // saves it, and is one of the commonest requests. Its photos and diagnosis are read beside
    // it, each otherwise waiting for the one before and then for a turn of the busy event loop;
    // a miss the member may not see answers 404 before either is used.
    const scope = missScopeSql(member);
    const [[row], photosOf, diagnosis] = await Promise.all([
      this.reader.rows<RawMissRow & { linesCheck: unknown }>(
        `SELECT ${OPEN_COLUMNS()} FROM "misses" WHERE "id" = ? AND ${scope.sql}`,
        [id, ...scope.params],
      ),
      this.photos.forMisses([id]),
      this.diagnoses.diagnosisOf(id),
    ]);
    if (!row) throw new NotFoundException(`No miss ${id} in this household`);
    const miss = fromRawRow(row);
    const photos = photosOf.get(miss.id) ?? [];
    return {
      ...toMissJson(miss, photos, diagnosis),
      linesCheck: jsonOf<Miss['linesCheck']>(row.linesCheck, null),
    };
  }

  /**
   * 404 both for what does not exist and for what is not this member's to see. `lock` takes its
   * row until `transaction` ends (rowLock): changes to its photos or rules at once go in turn.
   */
  async findModel(
    member: MemberContext,
    id: number,
    transaction?: Transaction,
    find: FindLock = {},
  ): Promise<Miss> {
    const miss = await this.missModel.findOne({
      where: { [Op.and]: [missScope(member), { id }] },
      transaction,
      lock: lockIf(find, transaction, this.missModel),
    });
    if (!miss) throw new NotFoundException(`No miss ${id} in this household`);
    return miss;
  }

  async update(member: MemberContext, id: number, dto: UpdateMissDto) {
    const miss = await this.findModel(member, id);
    if (dto.studentId !== undefined && dto.studentId !== miss.studentId) {
      await this.students.find(member, dto.studentId);
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
      ? this.diagnoses.wordProblem(
          dto.lines === undefined ? miss.lines : dto.lines,
          dto.stage === undefined ? miss.stage : dto.stage,
        )
      : null;
    const checked = rediagnose
      ? this.diagnoses.check(
          changes.problem ?? miss.problem,
          changes.answer ?? miss.answer,
          dto.steps === undefined ? miss.steps : dto.steps,
        )
      : null;
    await this.sequelize.transaction(async (transaction) => {
      // Locked first: new steps may change no column, and then the UPDATE locks nothing while
      // the diagnosis and rule rows are replaced (two at once met on their primary keys, 409).
      const locked = await this.findModel(member, id, transaction, { lock: true });
      await locked.update(
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
      if (checked && word) await this.diagnoses.writeRules(locked, checked, transaction, word);
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

  async remove(member: MemberContext, id: number): Promise<void> {
    const keys = await this.sequelize.transaction(async (transaction) => {
      const miss = await this.findModel(member, id, transaction);
      const found = await this.photos.keysOfMiss(miss.id, transaction);
      await miss.destroy({ transaction });
      return found;
    });
    await this.photos.removeKeys(keys);
  }
}

/** A JSON text column of a raw row, read as the model's getter reads it (jsonColumn). */

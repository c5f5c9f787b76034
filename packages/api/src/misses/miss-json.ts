import type { Diagnosis } from '@workback/core';
import { driverBoolean, driverDate } from '../database/sql-reader.js';
import type { PhotoJson } from '../photos/photos.service.js';
import type { Miss } from './models/miss.model.js';

/** A row of the notebook: everything but the full diagnosis. */
/** The columns a notebook page shows (toMissSummary). */
export const SUMMARY_ATTRIBUTES = [
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

export type SummaryFields = Pick<Miss, (typeof SUMMARY_ATTRIBUTES)[number]>;
export type RawMissRow = Record<(typeof SUMMARY_ATTRIBUTES)[number], unknown>;

/** A JSON text column of a raw row, parsed (the fallback for NULL). */
export function jsonOf<T>(v: unknown, fallback: T): T {
  return typeof v === 'string' ? (JSON.parse(v) as T) : ((v as T | null) ?? fallback);
}

/**
 * A raw row as the model would read it: JSON text parsed, SQLite's 0/1 as a boolean and its
 * date text ('2026-12-03 13:36:39.111 +00:00') as a Date. PostgreSQL's driver hands back
 * booleans and Dates already.
 */
export function fromRawRow(r: RawMissRow): SummaryFields {
  const json = jsonOf;
  return {
    ...(r as unknown as SummaryFields),
    steps: json(r.steps, null),
    skills: json(r.skills, []),
    revisit: json(r.revisit, []),
    lines: json(r.lines, null),
    ruleIds: json(r.ruleIds, []),
    correct: driverBoolean(r.correct),
    createdAt: driverDate(r.createdAt),
    updatedAt: driverDate(r.updatedAt),
  };
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

export function toMissJson(m: SummaryFields, photos: PhotoJson[], diagnosis: Diagnosis | null) {
  return {
    ...toMissSummary(m),
    diagnosis,
    photos,
    thumbnailPhotoId: photos[0]?.id ?? null,
    photoCount: photos.length,
  };
}

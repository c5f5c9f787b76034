import { Injectable, UnsupportedMediaTypeException } from '@nestjs/common';
import { InjectConnection } from '@nestjs/sequelize';
import { readKeyCsv, type KeyCsvProblem } from '@workback/core';
// The browser build: the web's import preview reads the file with this same parser.
import { parse } from 'csv-parse/browser/esm/sync';
import type { Sequelize } from 'sequelize-typescript';
import type { MemberContext } from '../common/member-context.js';
import { fieldsError } from '../common/pipes/validation.pipe.js';
import { AnswerKeysService } from './answer-keys.service.js';
import type { ImportAnswerKeyDto } from './dto/import-answer-key.dto.js';
import { checkItems, itemsError } from './key-item-checks.js';
import { writeKeyCsv } from './key-csv.js';

const CSV_TYPES = new Set([
  'text/csv',
  'text/plain',
  'application/csv',
  'text/comma-separated-values',
  'application/vnd.ms-excel',
]);

/** Answer keys in and out as CSV files (fixtures/keys/README.md). */
@Injectable()
export class KeyImportService {
  constructor(
    private readonly keys: AnswerKeysService,
    @InjectConnection() private readonly sequelize: Sequelize,
  ) {}

  /** A whole key from one CSV file: every bad row is listed, and nothing is saved unless all are good. */
  async importCsv(member: MemberContext, dto: ImportAnswerKeyDto, file?: Express.Multer.File) {
    if (!file) throw fieldsError({ file: 'file is missing: attach the CSV as “file”' });
    const looksLikeCsv = /\.(csv|txt)$/i.test(file.originalname) || CSV_TYPES.has(file.mimetype);
    if (!looksLikeCsv) {
      throw new UnsupportedMediaTypeException(
        `file must be a CSV text file (got ${file.mimetype || 'an unknown type'})`,
      );
    }
    let text: string;
    try {
      text = new TextDecoder('utf-8', { fatal: true }).decode(file.buffer);
    } catch {
      throw new UnsupportedMediaTypeException(
        'file is not UTF-8 text: save the spreadsheet as “CSV UTF-8”',
      );
    }
    if (text.includes('\u0000')) {
      throw new UnsupportedMediaTypeException('file is not a CSV text file');
    }
    // The same rules as the browser's preview (core's readKeyCsv); only the course is checked here.
    const read = readKeyCsv(text, { parse });
    const whole = read.problems.find((p) => p.line === 0);
    if (whole) throw fieldsError({ [whole.field]: whole.message });
    if (read.problems.some((p) => p.field === 'file' || p.field === 'header')) {
      throw itemsError(problemFields(read.problems), 'row', 'imported');
    }

    return this.sequelize.transaction(async (transaction) => {
      const lessons = await this.keys.lessonsFor(
        member,
        dto.courseId ?? null,
        dto.lessonNumber ?? null,
        transaction,
      );
      const items = checkItems(
        read.rows.map((r) => ({ ...r, number: Number(r.number) })),
        lessons,
        (i) => `line ${read.rows[i]!.line}`,
        problemFields(read.problems),
        'row',
      );
      return this.keys.saveKey(member, dto, items, transaction);
    });
  }

  async exportCsv(member: MemberContext, id: number) {
    const key = await this.keys.findKeyModel(member, id);
    const items = await this.keys.itemsOf(key.id);
    const slug =
      key.title
        .toLowerCase()
        .replace(/[^a-z0-9]+/g, '-')
        .replace(/^-|-$/g, '') || 'answer-key';
    return { filename: `${slug}.csv`, body: writeKeyCsv(items) };
  }
}

/** `{ 'line 4.answer': 'answer is missing (1 to 80 characters)' }`, as the web's preview reads them back. */
const problemFields = (problems: readonly KeyCsvProblem[]) =>
  Object.fromEntries(problems.map((p) => [`line ${p.line}.${p.field}`, p.message]));

import { readRevisit } from './readRevisit.js';

/** The answer-key CSV columns (fixtures/keys/README.md), in the order an export writes them. */
export const KEY_CSV_COLUMNS = [
  'number',
  'prompt',
  'answer',
  'skills',
  'revisit',
  'facts',
] as const;
export type KeyCsvColumn = (typeof KEY_CSV_COLUMNS)[number];
const REQUIRED: readonly KeyCsvColumn[] = ['number', 'prompt', 'answer'];

/** The most items one answer key holds. */
export const MAX_KEY_ITEMS = 300;

/** What csv-parse is asked for; the caller hands in its `parse` (the browser build in both places). */
export interface KeyCsvParseOptions {
  bom: true;
  info: true;
  relax_column_count: true;
  skip_empty_lines: true;
}
export type ParseCsv = (text: string, options: KeyCsvParseOptions) => unknown;

/** One item row as the file wrote it, cells trimmed and lists split. */
export interface KeyCsvRow {
  /** The line of the file the row starts on (the header is line 1). */
  line: number;
  number: string;
  prompt: string;
  answer: string;
  skills: string[];
  revisit: string[];
  facts: string[];
}

/** A problem by line and field; line 0 is the file as a whole. */
export interface KeyCsvProblem {
  line: number;
  field: string;
  message: string;
}

export interface KeyCsvRead {
  /** Rows with the header's number of values (problems in their cells are listed too). */
  rows: KeyCsvRow[];
  problems: KeyCsvProblem[];
}

type ParsedRecord = { record: string[]; info: { lines: number } };

// A spreadsheet reads a cell starting with = + - @ as a formula; export guards it with a quote.
const FORMULA_GUARD = /^'(?=[=+\-@\t\r])/;
// eslint-disable-next-line no-control-regex -- finding control characters is the point
const CONTROL_CHARS = /[\u0000-\u001f\u007f-\u009f]/;
const ONE_LINE = /^[^\r\n]*$/;

/**
 * Reads an answer-key CSV with every rule that needs no database, for the browser's preview
 * and the API's import alike: csv-parse splits it (BOM, CRLF, quoted cells), then the header,
 * each row's number of values, and each cell as the API's item fields check them. The API
 * also checks that revisited lessons exist in the chosen course.
 * `readKeyCsv('number,prompt,answer\n1,58 + 67,125', { parse })` → one row, no problems.
 */
export function readKeyCsv(text: string, options: { parse: ParseCsv }): KeyCsvRead {
  let records: ParsedRecord[];
  try {
    records = options.parse(text, {
      bom: true,
      info: true,
      relax_column_count: true,
      skip_empty_lines: true,
    }) as ParsedRecord[];
  } catch (e) {
    const code = (e as { code?: unknown }).code;
    if (typeof code !== 'string' || !code.startsWith('CSV_')) throw e;
    const line = (e as { lines?: number }).lines ?? 0;
    return fail(line, 'file', csvProblem(code, (e as Error).message));
  }
  const lines = records
    .map(({ record, info }) => ({
      cells: record.map((c) => c.trim().replace(FORMULA_GUARD, '')),
      // csv-parse counts lines up to the record's end; a quoted cell may span lines.
      line: info.lines - record.reduce((n, c) => n + (c.match(/\n/g)?.length ?? 0), 0),
    }))
    .filter(({ cells }) => cells.some((c) => c !== ''));
  const header = lines.shift();
  if (!header) return fail(1, 'file', 'the file is empty');

  const names = header.cells.map((c) => c.toLowerCase());
  const headerProblems: string[] = [];
  const unknown = names.filter((n) => !(KEY_CSV_COLUMNS as readonly string[]).includes(n));
  if (unknown.length)
    headerProblems.push(`unknown column ${unknown.map((u) => `“${u}”`).join(', ')}`);
  const missing = REQUIRED.filter((r) => !names.includes(r));
  if (missing.length) headerProblems.push(`missing column ${missing.join(', ')}`);
  const twice = names.filter((n, i) => names.indexOf(n) !== i);
  if (twice.length) headerProblems.push(`column ${twice.join(', ')} appears twice`);
  if (headerProblems.length) {
    const columns = KEY_CSV_COLUMNS.join(',');
    return fail(header.line, 'header', `${headerProblems.join('; ')} (the header is ${columns})`);
  }
  if (lines.length === 0) return fail(0, 'file', 'file has a header but no items');
  if (lines.length > MAX_KEY_ITEMS) {
    return fail(0, 'file', `file has ${lines.length} items; a key holds at most ${MAX_KEY_ITEMS}`);
  }

  const problems: KeyCsvProblem[] = [];
  const rows: KeyCsvRow[] = [];
  const firstLineOf = new Map<number, number>();
  for (const { cells, line } of lines) {
    if (cells.length !== names.length) {
      problems.push({
        line,
        field: 'columns',
        message: `has ${cells.length} values; the header has ${names.length} (put a cell holding a comma in double quotes)`,
      });
      continue;
    }
    const cell = (column: KeyCsvColumn) => {
      const index = names.indexOf(column);
      return index === -1 ? '' : cells[index]!;
    };
    const row: KeyCsvRow = {
      line,
      number: cell('number'),
      prompt: cell('prompt'),
      answer: cell('answer'),
      skills: splitList(cell('skills')),
      revisit: splitList(cell('revisit')),
      facts: splitList(cell('facts')),
    };
    rows.push(row);
    const found = cellProblems(row);
    const number = Number(row.number);
    if (!found.number) {
      const first = firstLineOf.get(number);
      if (first !== undefined) {
        found.number = `number ${number} is used twice (first at line ${first})`;
      } else firstLineOf.set(number, line);
    }
    for (const field of KEY_CSV_COLUMNS) {
      const message = found[field];
      if (message) problems.push({ line, field, message });
    }
  }
  return { rows, problems };
}

/** The checks of one item's fields, with the API's words (its KeyItemDto and revisit rules). */
function cellProblems(row: KeyCsvRow): Partial<Record<KeyCsvColumn, string>> {
  const found: Partial<Record<KeyCsvColumn, string>> = {};
  if (!/^\d+$/.test(row.number)) found.number = 'number must be a whole number';
  else if (Number(row.number) > 999) found.number = 'number must be at most 999';
  else if (Number(row.number) < 1) found.number = 'number must be 1 or more';

  if (!ONE_LINE.test(row.prompt)) found.prompt = 'prompt must be on one line';
  else if (!lengthWithin(row.prompt, 1, 200)) found.prompt = 'prompt must be 1 to 200 characters';
  if (!ONE_LINE.test(row.answer)) found.answer = 'answer must be on one line';
  else if (!lengthWithin(row.answer, 1, 80))
    found.answer = 'answer is missing (1 to 80 characters)';

  if (row.skills.some((s) => !lengthWithin(s, 1, 60)))
    found.skills = 'each skill must be 1 to 60 characters';
  else if (row.skills.length > 12) found.skills = 'skills can hold at most 12 entries';
  if (row.revisit.length > 20) found.revisit = 'revisit can hold at most 20 entries';
  if (row.facts.some((s) => !lengthWithin(s, 1, 40)))
    found.facts = 'each fact family must be 1 to 40 characters';
  else if (row.facts.length > 6) found.facts = 'facts can hold at most 6 entries';

  if (!found.revisit) {
    const read = readRevisit(row.revisit);
    if (!read.ok) found.revisit = read.message;
  }

  // One control character per row, the last such cell, as the API's request check reports it.
  for (const field of [...KEY_CSV_COLUMNS].reverse()) {
    const value = row[field];
    const cells = typeof value === 'string' ? [value] : value;
    const at = cells.findLastIndex((s) => CONTROL_CHARS.test(s));
    if (at === -1) continue;
    const path = typeof value === 'string' ? field : `${field}.${at}`;
    found[field] = `${path} must not hold control characters`;
    break;
  }
  return found;
}

const fail = (line: number, field: string, message: string): KeyCsvRead => ({
  rows: [],
  problems: [{ line, field, message }],
});

/** `'regrouping; subtraction'` → `['regrouping', 'subtraction']`. */
const splitList = (cell: string) =>
  cell
    .split(';')
    .map((s) => s.trim())
    .filter(Boolean);

/** Length as class-validator counts it: a surrogate pair or a presentation selector adds none. */
function lengthWithin(text: string, min: number, max: number): boolean {
  const selectors = text.match(/[^\uFE0F\uFE0E][\uFE0F\uFE0E]/g)?.length ?? 0;
  const pairs = text.match(/[\uD800-\uDBFF][\uDC00-\uDFFF]/g)?.length ?? 0;
  const length = text.length - selectors - pairs;
  return length >= min && length <= max;
}

function csvProblem(code: string, message: string): string {
  switch (code) {
    case 'CSV_QUOTE_NOT_CLOSED':
      return 'a double quote is opened and never closed';
    case 'CSV_INVALID_CLOSING_QUOTE':
      return 'a double quote in the middle of a cell; write it as two double quotes ("")';
    default:
      return `the file is not readable as CSV (${message})`;
  }
}

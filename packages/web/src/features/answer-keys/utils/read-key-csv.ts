import { revisitProblem, splitList } from './lists';

/** The columns of the answer-key CSV (fixtures/keys/README.md), in export order. */
export const CSV_COLUMNS = ['number', 'prompt', 'answer', 'skills', 'revisit', 'facts'] as const;
export type CsvColumn = (typeof CSV_COLUMNS)[number];
const REQUIRED: readonly CsvColumn[] = ['number', 'prompt', 'answer'];

export const MAX_CSV_BYTES = 2 * 1024 * 1024;
export const MAX_ITEMS = 300;

/** A problem with the file, by line (the header is line 1) and field, as the API names them. */
export type CsvProblem = { line: number; field: string; message: string };

export type PreviewRow = {
  line: number;
  number: string;
  prompt: string;
  answer: string;
  skills: string[];
  revisit: string[];
  facts: string[];
};

export type CsvPreview = { rows: PreviewRow[]; problems: CsvProblem[] };

type CsvRecord = { cells: string[]; line: number };

/** Splits CSV text (RFC 4180: quoted cells, doubled quotes, LF or CRLF) into records by line. */
function splitRecords(text: string): { records: CsvRecord[]; problem: CsvProblem | null } {
  const records: CsvRecord[] = [];
  let cells: string[] = [];
  let cell = '';
  let quoted = false;
  let afterQuote = false;
  let line = 1;
  let recordLine = 1;
  const endCell = () => {
    cells.push(cell);
    cell = '';
    afterQuote = false;
  };
  const endRecord = () => {
    endCell();
    records.push({ cells, line: recordLine });
    cells = [];
  };
  for (let i = 0; i < text.length; i++) {
    const ch = text[i]!;
    if (quoted) {
      if (ch === '"') {
        if (text[i + 1] === '"') {
          cell += '"';
          i++;
        } else {
          quoted = false;
          afterQuote = true;
        }
      } else {
        if (ch === '\n') line++;
        cell += ch;
      }
      continue;
    }
    if (ch === '"') {
      if (cell.trim() === '' && !afterQuote) {
        quoted = true;
        cell = '';
        continue;
      }
      return {
        records,
        problem: {
          line,
          field: 'file',
          message: 'a double quote in the middle of a cell; write it as two double quotes ("")',
        },
      };
    }
    if (ch === ',') endCell();
    else if (ch === '\r' && text[i + 1] === '\n') continue;
    else if (ch === '\n' || ch === '\r') {
      endRecord();
      line++;
      recordLine = line;
    } else if (!afterQuote || ch.trim() !== '') cell += ch;
  }
  if (quoted) {
    return {
      records,
      problem: {
        line: recordLine,
        field: 'file',
        message: 'a double quote is opened and never closed',
      },
    };
  }
  if (cell !== '' || cells.length > 0) endRecord();
  return { records, problem: null };
}

// A spreadsheet reads a cell starting with = + - @ as a formula; export guards it with a quote.
const FORMULA_GUARD = /^'(?=[=+\-@\t\r])/;

/**
 * Reads an answer-key CSV in the browser for the import preview, with the same checks the API
 * makes on each row (it checks again, and also that lessons exist in the chosen course).
 * `readKeyCsv('number,prompt,answer\n1,58 + 67,125')` → one row, no problems.
 */
export function readKeyCsv(raw: string): CsvPreview {
  const text = raw.replace(/^\uFEFF/, '');
  const { records, problem } = splitRecords(text);
  if (problem) return { rows: [], problems: [problem] };
  const nonEmpty = records
    .map((r) => ({ ...r, cells: r.cells.map((c) => c.trim().replace(FORMULA_GUARD, '')) }))
    .filter((r) => r.cells.some((c) => c !== ''));
  const header = nonEmpty.shift();
  if (!header)
    return { rows: [], problems: [{ line: 1, field: 'file', message: 'the file is empty' }] };

  const names = header.cells.map((c) => c.toLowerCase());
  const headerProblems: string[] = [];
  const unknown = names.filter((n) => !(CSV_COLUMNS as readonly string[]).includes(n));
  if (unknown.length)
    headerProblems.push(`unknown column ${unknown.map((u) => `“${u}”`).join(', ')}`);
  const missing = REQUIRED.filter((r) => !names.includes(r));
  if (missing.length) headerProblems.push(`missing column ${missing.join(', ')}`);
  if (headerProblems.length) {
    return {
      rows: [],
      problems: [
        {
          line: header.line,
          field: 'header',
          message: `${headerProblems.join('; ')} (the header is ${CSV_COLUMNS.join(',')})`,
        },
      ],
    };
  }
  if (nonEmpty.length === 0) {
    return {
      rows: [],
      problems: [{ line: 1, field: 'file', message: 'the file has a header but no items' }],
    };
  }

  const problems: CsvProblem[] = [];
  const rows: PreviewRow[] = [];
  const seen = new Map<string, number>();
  for (const { cells, line } of nonEmpty) {
    if (cells.length !== names.length) {
      problems.push({
        line,
        field: 'columns',
        message: `has ${cells.length} values; the header has ${names.length} (put a cell holding a comma in double quotes)`,
      });
      continue;
    }
    const value = (column: CsvColumn) => {
      const index = names.indexOf(column);
      return index === -1 ? '' : (cells[index] ?? '');
    };
    const row: PreviewRow = {
      line,
      number: value('number'),
      prompt: value('prompt'),
      answer: value('answer'),
      skills: splitList(value('skills')),
      revisit: splitList(value('revisit')),
      facts: splitList(value('facts')),
    };
    const add = (field: string, message: string) => problems.push({ line, field, message });
    if (!/^\d{1,3}$/.test(row.number) || Number(row.number) < 1) {
      add('number', 'number must be a whole number from 1 to 999');
    } else if (seen.has(row.number)) {
      add('number', `number ${row.number} is used twice (first at line ${seen.get(row.number)})`);
    } else seen.set(row.number, line);
    if (!row.prompt) add('prompt', 'prompt is missing');
    else if (row.prompt.length > 200) add('prompt', 'prompt must be at most 200 characters');
    if (!row.answer) add('answer', 'answer is missing');
    else if (row.answer.length > 80) add('answer', 'answer must be at most 80 characters');
    const revisit = revisitProblem(row.revisit.join(';'));
    if (revisit) add('revisit', revisit);
    rows.push(row);
  }
  if (rows.length + problems.filter((p) => p.field === 'columns').length > MAX_ITEMS) {
    problems.push({ line: 1, field: 'file', message: `a key holds at most ${MAX_ITEMS} items` });
  }
  return { rows, problems };
}

/**
 * The API's 400 for a refused file names fields `line 4.answer` (or `file`, `title`…):
 * `problemsFromFields({ 'line 4.answer': 'answer is missing' })` → `[{ line: 4, field: 'answer', … }]`.
 */
export function problemsFromFields(fields: Readonly<Record<string, string>>): CsvProblem[] {
  return Object.entries(fields)
    .map(([key, message]) => {
      const match = /^line (\d+)\.(.+)$/.exec(key);
      return match
        ? { line: Number(match[1]), field: match[2]!, message }
        : { line: 0, field: key, message };
    })
    .sort((a, b) => a.line - b.line);
}

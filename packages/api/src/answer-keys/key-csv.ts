import { CsvError, parse } from 'csv-parse/sync';
import { stringify } from 'csv-stringify/sync';

/**
 * The answer-key CSV format (documented in fixtures/keys/README.md): a header naming the
 * columns, then one item per row. `skills`, `revisit` and `facts` hold `;`-separated lists;
 * `revisit` takes lesson numbers and ranges such as `31-33`.
 */
export const CSV_COLUMNS = ['number', 'prompt', 'answer', 'skills', 'revisit', 'facts'] as const;
export type CsvColumn = (typeof CSV_COLUMNS)[number];
const REQUIRED: readonly CsvColumn[] = ['number', 'prompt', 'answer'];

export interface CsvRow {
  /** The line of the file the row starts on (the header is line 1). */
  line: number;
  values: Record<CsvColumn, string>;
}

export interface CsvProblem {
  line: number;
  field: string;
  message: string;
}

/** A readable file gives its rows and the rows it could not split (wrong number of values). */
export type CsvRead =
  { ok: true; rows: CsvRow[]; errors: CsvProblem[] } | { ok: false; errors: CsvProblem[] };

/** Splits a `;`-separated list cell: `'regrouping; subtraction'` → `['regrouping', 'subtraction']`. */
export const splitList = (cell: string) =>
  cell
    .split(';')
    .map((s) => s.trim())
    .filter(Boolean);

// A spreadsheet reads a cell starting with = + - @ as a formula; export guards it with a quote.
const FORMULA_GUARD = /^'(?=[=+\-@\t\r])/;

/** Reads the bytes of an uploaded key: UTF-8 with or without a BOM, LF or CRLF, quoted cells. */
export function readKeyCsv(text: string): CsvRead {
  let records: { record: string[]; info: { lines: number } }[];
  try {
    records = parse(text, {
      bom: true,
      info: true,
      relax_column_count: true,
      skip_empty_lines: true,
    }) as unknown as { record: string[]; info: { lines: number } }[];
  } catch (e) {
    if (e instanceof CsvError) {
      const line = (e as CsvError & { lines?: number }).lines ?? 0;
      return { ok: false, errors: [{ line, field: 'file', message: csvProblem(e) }] };
    }
    throw e;
  }
  const rows = records
    .map(({ record, info }) => ({
      cells: record.map((c) => c.trim().replace(FORMULA_GUARD, '')),
      // csv-parse counts lines up to the record's end; a quoted cell may span lines.
      line: info.lines - record.reduce((n, c) => n + (c.match(/\n/g)?.length ?? 0), 0),
    }))
    .filter(({ cells }) => cells.some((c) => c !== ''));
  const header = rows.shift();
  if (!header)
    return { ok: false, errors: [{ line: 1, field: 'file', message: 'the file is empty' }] };

  const names = header.cells.map((c) => c.toLowerCase());
  const headerErrors: string[] = [];
  const unknown = names.filter((n) => !(CSV_COLUMNS as readonly string[]).includes(n));
  if (unknown.length)
    headerErrors.push(`unknown column ${unknown.map((u) => `“${u}”`).join(', ')}`);
  const missing = REQUIRED.filter((r) => !names.includes(r));
  if (missing.length) headerErrors.push(`missing column ${missing.join(', ')}`);
  const twice = names.filter((n, i) => names.indexOf(n) !== i);
  if (twice.length) headerErrors.push(`column ${twice.join(', ')} appears twice`);
  if (headerErrors.length) {
    return {
      ok: false,
      errors: [
        {
          line: header.line,
          field: 'header',
          message: `${headerErrors.join('; ')} (the header is ${CSV_COLUMNS.join(',')})`,
        },
      ],
    };
  }

  const errors: CsvProblem[] = [];
  const out: CsvRow[] = [];
  for (const { cells, line } of rows) {
    if (cells.length !== names.length) {
      errors.push({
        line,
        field: 'columns',
        message: `has ${cells.length} values; the header has ${names.length} (put a cell holding a comma in double quotes)`,
      });
      continue;
    }
    const values = Object.fromEntries(CSV_COLUMNS.map((c) => [c, ''])) as Record<CsvColumn, string>;
    names.forEach((n, i) => (values[n as CsvColumn] = cells[i]!));
    out.push({ line, values });
  }
  return { ok: true, rows: out, errors };
}

function csvProblem(e: CsvError): string {
  switch (e.code) {
    case 'CSV_QUOTE_NOT_CLOSED':
      return 'a double quote is opened and never closed';
    case 'CSV_INVALID_CLOSING_QUOTE':
      return 'a double quote in the middle of a cell; write it as two double quotes ("")';
    default:
      return `the file is not readable as CSV (${e.message})`;
  }
}

/** Writes a key in the format `readKeyCsv` reads (BOM and CRLF, for spreadsheets). */
export function writeKeyCsv(
  items: readonly {
    number: number;
    prompt: string;
    answer: string;
    skills: readonly string[];
    revisit: readonly string[];
    facts: readonly string[];
  }[],
): string {
  return stringify(
    items.map((i) => [
      String(i.number),
      i.prompt,
      i.answer,
      i.skills.join('; '),
      i.revisit.join('; '),
      i.facts.join('; '),
    ]),
    {
      bom: true,
      header: true,
      columns: [...CSV_COLUMNS],
      record_delimiter: 'windows',
      escape_formulas: true,
    },
  );
}

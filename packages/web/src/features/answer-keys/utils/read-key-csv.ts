import {
  readKeyCsv as readKeyCsvRows,
  type KeyCsvProblem,
  type KeyCsvRead,
  type KeyCsvRow,
} from '@workback/core';
import { parse } from 'csv-parse/browser/esm/sync';

export const MAX_CSV_BYTES = 2 * 1024 * 1024;

/** A problem with the file, by line (the header is line 1; 0 is the whole file) and field. */
export type CsvProblem = KeyCsvProblem;
export type PreviewRow = KeyCsvRow;
export type CsvPreview = KeyCsvRead;

/**
 * Reads an answer-key CSV in the browser for the import preview: the same csv-parse build and
 * the same rules (in @workback/core) as the API's import, which also checks the course's lessons.
 * `readKeyCsv('number,prompt,answer\n1,58 + 67,125')` → one row, no problems.
 */
export const readKeyCsv = (text: string): CsvPreview => readKeyCsvRows(text, { parse });

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

import { KEY_CSV_COLUMNS } from '@workback/core';
import { stringify } from 'csv-stringify/sync';

/**
 * Writes a key in the format core's `readKeyCsv` reads (fixtures/keys/README.md): BOM and
 * CRLF for spreadsheets, `;`-separated lists, formula-like cells guarded with a quote.
 */
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
      columns: [...KEY_CSV_COLUMNS],
      record_delimiter: 'windows',
      escape_formulas: true,
    },
  );
}

import { parse } from 'csv-parse/browser/esm/sync';
import { describe, expect, it } from 'vitest';
import { readKeyCsv } from './readKeyCsv.js';

// The record splitting is csv-parse's (RFC 4180); these check the key's own rules on top of it.
const read = (text: string) => readKeyCsv(text, { parse });
const HEADER = 'number,prompt,answer,skills,revisit,facts';

describe('readKeyCsv', () => {
  it('reads quoted commas, a BOM, CRLF and blank lines, keeping each row’s line', () => {
    const text =
      `\uFEFF${HEADER}\r\n` +
      '7,47 x 24,"1,128",multiplication; partial products,10-11,\r\n' +
      '\r\n' +
      '8,"Nell has 3 bags, each with 8 shells",24,word problems,9; 14,eights\r\n';
    expect(read(text)).toEqual({
      rows: [
        {
          line: 2,
          number: '7',
          prompt: '47 x 24',
          answer: '1,128',
          skills: ['multiplication', 'partial products'],
          revisit: ['10-11'],
          facts: [],
        },
        {
          line: 4,
          number: '8',
          prompt: 'Nell has 3 bags, each with 8 shells',
          answer: '24',
          skills: ['word problems'],
          revisit: ['9', '14'],
          facts: ['eights'],
        },
      ],
      problems: [],
    });
  });

  it('takes the columns in any order, leaves out the optional ones and unguards formulas', () => {
    const { rows, problems } = read("Answer,Number,Prompt\n'-43,3,81 - 38\n");
    expect(problems).toEqual([]);
    expect(rows[0]).toMatchObject({ line: 2, number: '3', prompt: '81 - 38', answer: '-43' });
  });

  it('lists every bad row by line and field, in the API’s words', () => {
    const text = [
      HEADER,
      '1,58 + 67,125,,3,',
      '2,365 + 574,,,4,',
      '3,81 - 38,43,,7-5,',
      '1,27 x 4,108,,9,',
      '5,1,128 ÷ 8,141,,2,',
      'x,"two\nlines",43,,,',
      '1000,9 + 9,18,,,',
      `0,9 + 9,18,${'s;'.repeat(13)},,`,
    ].join('\n');
    expect(read(text).problems).toEqual([
      { line: 3, field: 'answer', message: 'answer is missing (1 to 80 characters)' },
      { line: 4, field: 'revisit', message: 'range “7-5” runs backwards; write 5-7' },
      { line: 5, field: 'number', message: 'number 1 is used twice (first at line 2)' },
      {
        line: 6,
        field: 'columns',
        message: 'has 7 values; the header has 6 (put a cell holding a comma in double quotes)',
      },
      { line: 7, field: 'number', message: 'number must be a whole number' },
      { line: 7, field: 'prompt', message: 'prompt must not hold control characters' },
      { line: 9, field: 'number', message: 'number must be at most 999' },
      { line: 10, field: 'number', message: 'number must be 1 or more' },
      { line: 10, field: 'skills', message: 'skills can hold at most 12 entries' },
    ]);
  });

  it('names a wrong header, an unclosed quote, an empty file and one without items', () => {
    expect(read('num,prompt,answer,answer\n1,2 + 2,4,4').problems).toEqual([
      {
        line: 1,
        field: 'header',
        message:
          'unknown column “num”; missing column number; column answer appears twice (the header is number,prompt,answer,skills,revisit,facts)',
      },
    ]);
    expect(read(`${HEADER}\n1,58 + 67,125,,,\n2,"81 - 38,43,,,\n`).problems).toEqual([
      { line: 3, field: 'file', message: 'a double quote is opened and never closed' },
    ]);
    expect(read('').problems).toEqual([{ line: 1, field: 'file', message: 'the file is empty' }]);
    expect(read(`${HEADER}\n\n`).problems).toEqual([
      { line: 0, field: 'file', message: 'file has a header but no items' },
    ]);
  });

  it('refuses more items than a key holds', () => {
    const rows = Array.from({ length: 301 }, (_, i) => `${i + 1},${i} + 1,${i + 1}`);
    expect(read(['number,prompt,answer', ...rows].join('\n'))).toEqual({
      rows: [],
      problems: [
        { line: 0, field: 'file', message: 'file has 301 items; a key holds at most 300' },
      ],
    });
  });
});

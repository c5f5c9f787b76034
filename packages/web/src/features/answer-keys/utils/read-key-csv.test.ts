import { describe, expect, it } from 'vitest';

import { problemsFromFields, readKeyCsv } from './read-key-csv';

describe('readKeyCsv', () => {
  it('reads quoted commas, a BOM, CRLF and a cell over two lines, keeping each row’s first line', () => {
    const text =
      '\uFEFFnumber,prompt,answer,skills,revisit,facts\r\n' +
      '7,47 x 24,"1,128",multiplication; partial products,10-11,\r\n' +
      '\r\n' +
      '8,"Nell has 3 bags,\r\neach with 8 shells",24,word problems,9; 14,eights\r\n';
    const { rows, problems } = readKeyCsv(text);
    expect(problems).toEqual([]);
    expect(rows).toEqual([
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
        prompt: 'Nell has 3 bags,\r\neach with 8 shells',
        answer: '24',
        skills: ['word problems'],
        revisit: ['9', '14'],
        facts: ['eights'],
      },
    ]);
  });

  it('takes the columns in any order and leaves out the optional ones', () => {
    const { rows, problems } = readKeyCsv('Answer,Number,Prompt\n43,3,81 - 38\n');
    expect(problems).toEqual([]);
    expect(rows[0]).toMatchObject({ line: 2, number: '3', prompt: '81 - 38', answer: '43' });
  });

  it('lists every bad row by line and field', () => {
    const text = [
      'number,prompt,answer,skills,revisit,facts',
      '1,58 + 67,125,,3,',
      '2,365 + 574,,,4,',
      '3,81 - 38,43,,7-5,',
      '3,27 x 4,108,,9,',
      '5,1,128 ÷ 8,141,,2,',
    ].join('\n');
    expect(readKeyCsv(text).problems).toEqual([
      { line: 3, field: 'answer', message: 'answer is missing' },
      { line: 4, field: 'revisit', message: 'The range “7-5” runs backwards: write 5-7.' },
      { line: 5, field: 'number', message: 'number 3 is used twice (first at line 4)' },
      {
        line: 6,
        field: 'columns',
        message: 'has 7 values; the header has 6 (put a cell holding a comma in double quotes)',
      },
    ]);
  });

  it('names a wrong header and an unclosed quote', () => {
    expect(readKeyCsv('num,prompt,answer\n1,2 + 2,4').problems).toEqual([
      {
        line: 1,
        field: 'header',
        message:
          'unknown column “num”; missing column number (the header is number,prompt,answer,skills,revisit,facts)',
      },
    ]);
    expect(readKeyCsv('number,prompt,answer\n1,"2 + 2,4\n').problems[0]).toMatchObject({
      field: 'file',
      message: 'a double quote is opened and never closed',
    });
    expect(readKeyCsv('number,prompt,answer\n').problems[0]?.message).toBe(
      'the file has a header but no items',
    );
  });
});

describe('problemsFromFields', () => {
  it('reads the API’s `line N.field` names in line order', () => {
    expect(
      problemsFromFields({
        'line 6.revisit': 'lesson 40 is not in “Number Trail”',
        'line 2.answer': 'answer is missing (1 to 80 characters)',
        file: 'is over 2 MiB',
      }),
    ).toEqual([
      { line: 0, field: 'file', message: 'is over 2 MiB' },
      { line: 2, field: 'answer', message: 'answer is missing (1 to 80 characters)' },
      { line: 6, field: 'revisit', message: 'lesson 40 is not in “Number Trail”' },
    ]);
  });
});

import { describe, expect, it } from 'vitest';

import { revisitProblem } from './lists';
import { problemsFromFields, readKeyCsv } from './read-key-csv';

// The key CSV rules are core's (packages/core/src/keys/readKeyCsv.test.ts); the API's
// csv-import test feeds one file through this preview and the import and compares them.
describe('readKeyCsv', () => {
  it('reads the file in the browser with the same rules as the import', () => {
    const text =
      '\uFEFFnumber,prompt,answer,revisit\r\n' +
      '7,47 x 24,"1,128",10-11\r\n' +
      '\r\n' +
      '8,81 - 38,,7-5\r\n';
    expect(readKeyCsv(text)).toEqual({
      rows: [
        {
          line: 2,
          number: '7',
          prompt: '47 x 24',
          answer: '1,128',
          skills: [],
          revisit: ['10-11'],
          facts: [],
        },
        {
          line: 4,
          number: '8',
          prompt: '81 - 38',
          answer: '',
          skills: [],
          revisit: ['7-5'],
          facts: [],
        },
      ],
      problems: [
        { line: 4, field: 'answer', message: 'answer is missing (1 to 80 characters)' },
        { line: 4, field: 'revisit', message: 'range “7-5” runs backwards; write 5-7' },
      ],
    });
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

describe('revisitProblem', () => {
  it('checks typed lessons with the rule the import uses, as a sentence', () => {
    expect(revisitProblem('12; 31 – 33')).toBeNull();
    expect(revisitProblem('12; 7-5')).toBe('Range “7-5” runs backwards; write 5-7.');
    expect(revisitProblem('1-80')).toBe('Range “1-80” spans more than 60 lessons.');
  });
});

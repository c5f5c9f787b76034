// Thousands written with a comma between groups of three, as issue 11 writes them ("960 +
// 4,455 → 4,325"): common practice, no source. Checked against JavaScript's own
// Intl.NumberFormat('en-US') grouping (ECMA-402), which the project did not write.
import { describe, expect, it } from 'vitest';
import { groupThousands } from './groupThousands.js';

const en = new Intl.NumberFormat('en-US', { maximumFractionDigits: 20 });

describe('groupThousands', () => {
  it.each(['1000', '4455', '12345', '999999', '1000000', '123456789012'])(
    'writes %s as Intl.NumberFormat en-US does',
    (n) => expect(groupThousands(n)).toBe(en.format(BigInt(n))),
  );

  it('groups the numbers of a sentence, and only the whole part of a decimal', () => {
    expect(groupThousands('Worked that way, 960 + 4455 gives 4325.')).toBe(
      'Worked that way, 960 + 4,455 gives 4,325.',
    );
    expect(groupThousands('$1250.75 and 0.12345 and 1234.5678')).toBe(
      '$1,250.75 and 0.12345 and 1,234.5678',
    );
  });

  it('leaves short numbers, grouped numbers, leading zeros and digits joined to letters alone', () => {
    for (const text of ['partial product 2', '999 + 1', '4,455', '0123', '10^13 place', 'x1234'])
      expect(groupThousands(text)).toBe(text);
  });
});

import type { RuleInfo } from '../rules/catalog.js';

/** A source of numbers in [0, 1), such as `seededRandom(seed)`. */
export type Random = () => number;

const int = (random: Random, lo: number, hi: number): number =>
  lo + Math.floor(random() * (hi - lo + 1));

/** A number with exactly `digits` digits; zeros are made more likely so regrouping-across-zero cases turn up. */
function wholeOf(random: Random, digits: number, zeroBias = 0.25): string {
  let s = String(int(random, 1, 9));
  for (let i = 1; i < digits; i += 1) s += random() < zeroBias ? '0' : String(int(random, 0, 9));
  return s;
}

/**
 * How practice numbers are written: whole numbers, decimals, or money (`$` and two places).
 * The column rules (`add.*`, `sub.*`) keep their ids on lined-up points, so their practice can
 * be written in the form of the child's own miss.
 */
export type PracticeForm = 'whole' | 'decimal' | 'money';

/** `'7050'` with 2 places → `'70.50'`; `'5'` → `'0.05'`. */
function withPoint(digits: string, places: number): string {
  const padded = digits.padStart(places + 1, '0');
  return `${padded.slice(0, -places)}.${padded.slice(-places)}`;
}

/**
 * A fresh problem, as text, of the kind on which the rule's method shows: numbers with
 * `digits` digits, zeros where the rule needs them. The same random sequence gives the same problem.
 * With `form: 'money'` (or `'decimal'`) a column rule's problem is written with the point (and `$`),
 * `digits` counting the figures on both sides of the point.
 * `candidateProblem(ruleInfo('round.half-down'), random, 4)` → `'round 7350 to the nearest hundred'`;
 * `candidateProblem(ruleInfo('sub.borrow-no-decrement'), random, 4, { form: 'money' })` → `'$70.50 - $3.86'`.
 */
export function candidateProblem(
  info: RuleInfo,
  random: Random,
  digits: number,
  options: { readonly form?: PracticeForm } = {},
): string {
  const form = options.form ?? 'whole';
  const columns =
    (info.operation === 'addition' || info.operation === 'subtraction') &&
    !info.id.endsWith('.left-aligned');
  if (form !== 'whole' && columns) {
    const places = form === 'money' ? 2 : 1 + Math.floor(random() * 2);
    const whole = candidateProblem(info, random, Math.max(digits, places + 1));
    const sign = form === 'money' ? '$' : '';
    return whole.replace(/\d+/g, (n) => `${sign}${withPoint(n, places)}`);
  }
  if (form === 'money' && info.id === 'dec.point-dropped')
    return candidateProblem(info, random, digits).replace(
      /(\d+)\.(\d+)/g,
      (_, whole: string, cents: string) => `$${whole}.${cents.padEnd(2, '0')}`,
    );
  const d = Math.max(1, digits);
  switch (info.operation) {
    case 'addition': {
      const other =
        info.id === 'add.left-aligned'
          ? int(random, 1, Math.max(1, d - 1))
          : int(random, Math.max(1, d - 1), d);
      return `${wholeOf(random, d, 0.1)} + ${wholeOf(random, other, 0.1)}`;
    }
    case 'subtraction': {
      const top = wholeOf(
        random,
        Math.max(2, d),
        info.id === 'sub.n-minus-zero-is-zero' ? 0.1 : 0.35,
      );
      const len =
        info.id === 'sub.left-aligned'
          ? int(random, 1, top.length - 1)
          : int(random, Math.max(1, top.length - 1), top.length);
      const bottom = wholeOf(random, len, info.id === 'sub.n-minus-zero-is-zero' ? 0.4 : 0.1);
      return `${top} - ${bottom}`;
    }
    case 'multiplication': {
      const two = info.id === 'mul.no-placeholder' || info.id === 'mul.partials-added-wrong';
      if (info.id === 'mul.zeros-dropped' || info.id === 'mul.zeros-extra') {
        const top = `${int(random, 1, 9)}${'0'.repeat(int(random, 1, Math.max(1, d - 1)))}`;
        return `${top} x ${int(random, 1, 9)}${'0'.repeat(int(random, 0, 2))}`;
      }
      return `${wholeOf(random, d, info.id === 'mul.zero-times-n-is-n' ? 0.4 : 0.1)} x ${two ? wholeOf(random, 2, 0.1) : String(int(random, 2, 9))}`;
    }
    case 'division': {
      const divisor = int(random, 2, 9);
      const zeroQuotient = info.id === 'div.quotient-zero-omitted';
      if (zeroQuotient) {
        // Build the quotient with a 0 in it, so a brought-down number is smaller than the divisor.
        let q = String(int(random, 1, 9));
        for (let i = 1; i < Math.max(3, d); i += 1) q += i === 1 ? '0' : String(int(random, 0, 9));
        return `${BigInt(q) * BigInt(divisor) + BigInt(int(random, 0, divisor - 1))} ÷ ${divisor}`;
      }
      return `${wholeOf(random, Math.max(2, d), 0.1)} ÷ ${divisor}`;
    }
    case 'rounding': {
      const names = ['ten', 'hundred', 'thousand', 'ten thousand', 'hundred thousand', 'million'];
      const length = Math.max(info.id === 'round.chained' ? 3 : 2, d);
      const exponent = int(random, info.id === 'round.chained' ? 2 : 1, length - 1);
      const digits = [...wholeOf(random, length, 0.15)];
      const at = (e: number, digit: string): void => {
        digits[length - 1 - e] = digit;
      };
      // Some habits show only on particular digits: an exact half, a 4 before a 5, a 9 to round up.
      if (info.id === 'round.half-down') {
        at(exponent - 1, '5');
        for (let e = 0; e < exponent - 1; e += 1) at(e, '0');
      } else if (info.id === 'round.chained') {
        for (let e = 1; e < exponent; e += 1) at(e, '4');
        at(0, String(int(random, 5, 9)));
      } else if (info.id === 'round.carry-lost' && exponent < length - 1) {
        at(exponent, '9');
        at(exponent - 1, String(int(random, 5, 9)));
      }
      return `round ${digits.join('')} to the nearest ${names[exponent - 1] ?? 'ten'}`;
    }
    case 'missing': {
      const ops = ['+', '-', 'x', '÷'] as const;
      const op = ops[int(random, 0, 3)] as (typeof ops)[number];
      const a = BigInt(wholeOf(random, d, 0.1));
      const b = BigInt(op === 'x' || op === '÷' ? int(random, 2, 9) : wholeOf(random, d, 0.1));
      const blankFirst = random() < 0.5;
      if (op === '+') return blankFirst ? `? + ${b} = ${a + b}` : `${a} + ? = ${a + b}`;
      if (op === '-') return blankFirst ? `? - ${b} = ${a}` : `${a + b} - ? = ${a}`;
      if (op === 'x') return blankFirst ? `? x ${b} = ${a * b}` : `${b} x ? = ${a * b}`;
      return blankFirst ? `? ÷ ${b} = ${a}` : `${a * b} ÷ ? = ${a}`;
    }
    case 'fraction': {
      const max = d <= 1 ? 9 : 12;
      if (info.id === 'frac.larger-denominator-larger') {
        const n = int(random, 1, 3);
        return `${n}/${int(random, n + 1, max)} ? ${n}/${int(random, n + 1, max)}`;
      }
      const q = int(random, 2, max);
      const s = int(random, 2, max);
      return `${int(random, 1, q - 1)}/${q} + ${int(random, 1, s - 1)}/${s}`;
    }
    case 'decimal': {
      const w = () => String(int(random, 0, 10 ** Math.max(1, d - 2) - 1));
      const places = (n: number) => Array.from({ length: n }, () => int(random, 0, 9)).join('');
      if (info.id === 'dec.longer-is-larger' || info.id === 'dec.shorter-is-larger') {
        const whole = w();
        const a = int(random, 1, 9);
        const b = info.id === 'dec.longer-is-larger' ? int(random, 0, a - 1) : int(random, a, 9);
        const long = `${whole}.${b}${int(random, 1, 9)}`;
        const short = `${whole}.${a}`;
        return random() < 0.5 ? `${long} ? ${short}` : `${short} ? ${long}`;
      }
      if (info.id === 'dec.point-as-in-addition')
        return `${w()}.${int(random, 1, 9)} x ${int(random, 0, 9)}.${int(random, 1, 9)}`;
      const a = `${int(random, 1, 10 ** Math.max(1, d - 1) - 1)}.${places(int(random, 1, 2))}`;
      const b = `${w()}.${places(info.id === 'dec.right-aligned' ? 3 - (a.split('.')[1] ?? '').length : int(random, 1, 2))}`;
      const [x, y] = Number(a) >= Number(b) ? [a, b] : [b, a];
      return random() < 0.5 ? `${x} + ${y}` : `${x} - ${y}`;
    }
    case 'time': {
      const h = () => int(random, 1, 11);
      const m = (lo: number, hi: number) => String(int(random, lo, hi)).padStart(2, '0');
      if (info.id === 'time.minutes-not-carried') {
        const m1 = int(random, 30, 55);
        return `${h()}:${String(m1)} + ${h()}:${m(60 - m1, 59)}`;
      }
      const h1 = int(random, 2, 11);
      const m1 = int(random, 0, 45);
      return `${h1}:${String(m1).padStart(2, '0')} - ${int(random, 1, h1 - 1)}:${m(m1 + 1, 59)}`;
    }
  }
}

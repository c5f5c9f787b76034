// The error rule catalog of DESIGN.md. Ids are part of the contract and never renamed;
// the list order is the catalog order used to break ties when ranking.

export interface RuleInfo {
  readonly id: string;
  /** The problem kind the rule works on. */
  readonly operation:
    | 'addition'
    | 'subtraction'
    | 'multiplication'
    | 'division'
    | 'missing'
    | 'rounding'
    | 'fraction'
    | 'decimal'
    | 'time';
  /** `systematic` — a consistent wrong method; `fact` — one basic fact wrong, the method right. */
  readonly kind: 'systematic' | 'fact';
  readonly title: string;
  readonly description: string;
  /** The catalog's own example: the problem, what the rule writes, the correct answer. */
  readonly example: {
    readonly problem: string;
    readonly writes: string;
    readonly correct: string;
  } | null;
}

const rule = (
  id: string,
  operation: RuleInfo['operation'],
  title: string,
  description: string,
  example: [string, string, string] | null,
): RuleInfo => ({
  id,
  operation,
  kind: id.endsWith('.fact') ? 'fact' : 'systematic',
  title,
  description,
  example:
    example === null ? null : { problem: example[0], writes: example[1], correct: example[2] },
});

/**
 * Every error rule, in catalog order.
 * `RULES[0]` → `{ id: 'add.no-carry', operation: 'addition', kind: 'systematic', title: 'Carry dropped', … }`.
 */
export const RULES: readonly RuleInfo[] = [
  rule(
    'add.no-carry',
    'addition',
    'Carry dropped',
    'Writes the ones digit of each column sum and drops the carry; the leftmost column is written whole.',
    ['58 + 67', '115', '125'],
  ),
  rule(
    'add.carry-written',
    'addition',
    'Whole column sums written',
    'Writes every column’s whole sum side by side, with no carrying.',
    ['58 + 67', '1115', '125'],
  ),
  rule(
    'add.carry-reversed',
    'addition',
    'Carry reversed',
    'Writes the tens digit of a column sum and carries the ones digit.',
    ['27 + 16', '61', '43'],
  ),
  rule(
    'add.left-aligned',
    'addition',
    'Numbers lined up on the left',
    'Lines the numbers up on the left, as if the shorter one had zeros on its right.',
    ['352 + 41', '762', '393'],
  ),
  rule(
    'add.writes-carry',
    'addition',
    'Carried 1 written in the column',
    'When a column sum is 10 or more, writes the carried 1 in that column and carries nothing.',
    ['365 + 574', '819', '939'],
  ),
  rule(
    'add.fact',
    'addition',
    'One addition fact',
    'One column’s basic fact is wrong; the rest of the working is right.',
    null,
  ),
  rule(
    'sub.smaller-from-larger',
    'subtraction',
    'Smaller digit taken from larger',
    'In every column takes the smaller digit from the larger, never regrouping.',
    ['81 − 38', '57', '43'],
  ),
  rule(
    'sub.borrow-no-decrement',
    'subtraction',
    'Ten added, nothing taken',
    'Adds ten to the top digit when it must regroup, but never reduces the digit it took from.',
    ['81 − 38', '53', '43'],
  ),
  rule(
    'sub.borrow-across-zero',
    'subtraction',
    'Zeros skipped when regrouping',
    'When it must regroup and the next top digit is 0, skips the zeros and takes one from the nearest non-zero digit; the zeros stay 0 and regroup again for themselves when they must.',
    ['304 − 75', '139', '229'],
  ),
  rule(
    'sub.borrow-from-zero',
    'subtraction',
    'Zero changed to 9, regrouping stopped',
    'When it must regroup from a 0, changes that 0 to 9 but does not go on to take one from the digit to its left.',
    ['1300 − 522', '878', '778'],
  ),
  rule(
    'sub.zero-minus-n-is-n',
    'subtraction',
    '0 − N written as N',
    'A column 0 − N is written as N; other columns regroup correctly.',
    ['40 − 13', '33', '27'],
  ),
  rule(
    'sub.zero-minus-n-is-zero',
    'subtraction',
    '0 − N written as 0',
    'A column 0 − N is written as 0; other columns regroup correctly.',
    ['40 − 13', '30', '27'],
  ),
  rule(
    'sub.n-minus-zero-is-zero',
    'subtraction',
    'N − 0 written as 0',
    'A column N − 0 is written as 0.',
    ['47 − 20', '20', '27'],
  ),
  rule(
    'sub.left-aligned',
    'subtraction',
    'Numbers lined up on the left',
    'Lines the numbers up on the left, as if the shorter one had zeros on its right.',
    ['4261 − 32', '1061', '4229'],
  ),
  rule(
    'sub.fact',
    'subtraction',
    'One subtraction fact',
    'One column’s basic fact is wrong; the rest of the working is right.',
    null,
  ),
  rule(
    'mul.carry-before-multiplying',
    'multiplication',
    'Carry added before multiplying',
    'Adds the carried digit to the next top digit, then multiplies.',
    ['27 × 4', '168', '108'],
  ),
  rule(
    'mul.no-carry',
    'multiplication',
    'Carry dropped',
    'Writes each product’s ones digit and drops the carry; the leftmost product is written whole.',
    ['27 × 4', '88', '108'],
  ),
  rule(
    'mul.carry-written',
    'multiplication',
    'Whole products written',
    'Writes every digit’s whole product side by side.',
    ['27 × 4', '828', '108'],
  ),
  rule(
    'mul.carry-reversed',
    'multiplication',
    'Carry reversed',
    'Writes the tens digit of a product and carries the ones digit.',
    ['97 × 3', '282', '291'],
  ),
  rule(
    'mul.zero-times-n-is-n',
    'multiplication',
    '0 × N taken as N',
    'A 0 digit times N is taken as N.',
    ['304 × 2', '628', '608'],
  ),
  rule(
    'mul.no-placeholder',
    'multiplication',
    'Partial products not shifted',
    'With a multiplier of two or more digits, writes each partial product without shifting it left, then adds.',
    ['34 × 12', '102', '408'],
  ),
  rule(
    'mul.zeros-dropped',
    'multiplication',
    'Zeros of one factor only',
    'Multiplies the non-zero parts and puts back the zeros of one factor only.',
    ['400 × 30', '1200', '12000'],
  ),
  rule(
    'mul.zeros-extra',
    'multiplication',
    'One zero too many',
    'Puts back one zero more than the factors have.',
    ['400 × 30', '120000', '12000'],
  ),
  rule(
    'mul.partials-added-wrong',
    'multiplication',
    'Partial products added wrongly',
    'Every partial product is right; their sum is not (needs the written steps).',
    null,
  ),
  rule(
    'mul.fact',
    'multiplication',
    'One multiplication fact',
    'One basic multiplication fact is wrong; the rest of the working is right.',
    null,
  ),
  rule(
    'div.quotient-zero-omitted',
    'division',
    'Zero left out of the quotient',
    'When a brought-down number is smaller than the divisor, writes no 0 in the quotient.',
    ['612 ÷ 6', '12', '102'],
  ),
  rule(
    'div.remainder-too-large',
    'division',
    'Remainder not smaller than the divisor',
    'Stops with a remainder as large as the divisor or larger, so the quotient is one or more too small.',
    ['45 ÷ 6', '6 R 9', '7 R 3'],
  ),
  rule(
    'div.remainder-as-decimal',
    'division',
    'Remainder written as a decimal',
    'Writes q R r as the decimal q.r.',
    ['45 ÷ 6', '7.3', '7 R 3'],
  ),
  rule(
    'div.remainders-dropped',
    'division',
    'Each digit divided on its own',
    'Divides each digit on its own, dropping every partial remainder but the last.',
    ['75 ÷ 3', '21 R 2', '25'],
  ),
  rule(
    'div.fact',
    'division',
    'One division fact',
    'A division fact confused with a neighbouring multiple.',
    ['42 ÷ 7', '7', '6'],
  ),
  rule(
    'missing.used-wrong-operation',
    'missing',
    'Operation not undone',
    'Works the two numbers shown with the operation that does not undo the equation (adds where it should subtract, and so on).',
    ['90 − ? = 35', '125', '55'],
  ),
  rule(
    'missing.copied-result',
    'missing',
    'A number from the problem copied',
    'Answers with a number already in the problem.',
    ['? + 38 = 91', '91', '53'],
  ),
  rule(
    'round.truncated',
    'rounding',
    'Digits cut off',
    'Always keeps the digit in the place and drops what follows.',
    ['round 3456 to nearest hundred', '3400', '3500'],
  ),
  rule(
    'round.half-down',
    'rounding',
    'Exactly half rounded down',
    'A 5 followed by nothing rounds down; otherwise the rounding is right.',
    ['round 2350 to nearest hundred', '2300', '2400'],
  ),
  rule(
    'round.wrong-place',
    'rounding',
    'Rounded to the next smaller place',
    'Rounds to the next smaller place instead.',
    ['round 4372 to nearest hundred', '4370', '4400'],
  ),
  rule(
    'round.chained',
    'rounding',
    'Rounded step by step',
    'Rounds step by step from the ones up to the place.',
    ['round 3449 to nearest hundred', '3500', '3400'],
  ),
  rule(
    'round.carry-lost',
    'rounding',
    'Carry lost past a 9',
    'When the place’s digit is 9 and must round up, writes 0 there without carrying into the place to its left.',
    ['round 3962 to nearest hundred', '3000', '4000'],
  ),
  rule(
    'round.lower-digits-kept',
    'rounding',
    'Digits after the place kept',
    'Changes the place’s digit correctly but keeps the digits after it.',
    ['round 3456 to nearest hundred', '3556', '3500'],
  ),
  rule(
    'frac.add-across',
    'fraction',
    'Tops and bottoms added',
    'Adds (or subtracts) the numerators and the denominators separately.',
    ['1/2 + 1/3', '2/5', '5/6'],
  ),
  rule(
    'frac.larger-denominator-larger',
    'fraction',
    'Larger bottom number taken as larger',
    'For equal numerators, calls the fraction with the larger denominator larger.',
    ['1/3 ? 1/5', '<', '>'],
  ),
  rule(
    'frac.numerator-only',
    'fraction',
    'Only the tops added',
    'With unlike denominators, adds the numerators and keeps one of the denominators.',
    ['1/4 + 1/2', '2/4', '3/4'],
  ),
  // Decimals and money: once the points are lined up, the column rules above keep their ids.
  rule(
    'dec.right-aligned',
    'decimal',
    'Last digits lined up, not the points',
    'Lines up the last digits instead of the points, works the columns as whole numbers, and places the point as many places from the right as the longer decimal part.',
    ['4.5 + 2.25', '2.70', '6.75'],
  ),
  rule(
    'dec.point-dropped',
    'decimal',
    'Point left out',
    'Works the digits correctly but writes no point.',
    ['4.5 + 2.25', '675', '6.75'],
  ),
  rule(
    'dec.longer-is-larger',
    'decimal',
    'More decimal digits taken as larger',
    'Comparing, takes the number with more digits after the point as larger.',
    ['0.45 ? 0.5', '>', '<'],
  ),
  rule(
    'dec.shorter-is-larger',
    'decimal',
    'Fewer decimal digits taken as larger',
    'Comparing, takes the number with fewer digits after the point as larger.',
    ['0.4 ? 0.45', '>', '<'],
  ),
  rule(
    'dec.point-as-in-addition',
    'decimal',
    'Point placed as in addition',
    'Multiplying, places the point as in addition: as many places as the factor with the most.',
    ['0.3 × 0.2', '0.6', '0.06'],
  ),
  // Clock times h:mm.
  rule(
    'time.hundred-minutes',
    'time',
    'An hour taken as 100 minutes',
    'Subtracts clock times as if an hour had 100 minutes.',
    ['3:15 − 1:50', '1:65', '1:25'],
  ),
  rule(
    'time.minutes-not-carried',
    'time',
    '60 minutes not made an hour',
    'Adding, leaves 60 or more minutes unconverted.',
    ['2:45 + 1:30', '3:75', '4:15'],
  ),
];

/** `ruleInfo('sub.fact')?.kind` → `'fact'`; unknown ids → `undefined`. */
export function ruleInfo(id: string): RuleInfo | undefined {
  return RULE_INDEX.get(id);
}

/** Position in the catalog, for tie-breaking: `ruleOrder('add.no-carry')` → `0`. */
export function ruleOrder(id: string): number {
  return RULE_POSITION.get(id) ?? RULES.length;
}

const RULE_INDEX: ReadonlyMap<string, RuleInfo> = new Map(RULES.map((r) => [r.id, r]));
const RULE_POSITION: ReadonlyMap<string, number> = new Map(RULES.map((r, i) => [r.id, i]));

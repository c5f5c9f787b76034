import { trailingZeros } from '../numbers/digits.js';
import type { LongMultiplicationTrace } from '../trace/types.js';
import { multiplyLong } from './multiplyLong.js';

/**
 * The shortcut for factors ending in zeros: set the zeros aside, multiply what is left,
 * then write `appended` zeros (the correct shortcut puts back all of them). Returns null
 * when neither factor ends in 0.
 * `multiplyWithZerosSetAside('400', '30', 3)?.result` → `'12000'`; with 2 → `'1200'`.
 */
export function multiplyWithZerosSetAside(
  top: string,
  bottom: string,
  appended: number,
): { result: string; trace: LongMultiplicationTrace } | null {
  const zt = trailingZeros(top);
  const zb = trailingZeros(bottom);
  if (zt + zb === 0) return null;
  const core = multiplyLong(top.slice(0, top.length - zt), bottom.slice(0, bottom.length - zb));
  const result = core.result === '0' ? '0' : core.result + '0'.repeat(appended);
  return {
    result,
    trace: { ...core.trace, top, bottom, zeros: { top: zt, bottom: zb, appended }, result },
  };
}

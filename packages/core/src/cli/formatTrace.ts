import type { WorkingTrace } from '../trace/types.js';

const pad = (s: string, width: number): string => s.padStart(width, ' ');

/**
 * A plain-text drawing of a working for the terminal, one string per line.
 * `formatTrace(subtractionTrace)` → `['  304', '−  75', '─────', '  229', 'regrouping: …']`.
 */
export function formatTrace(trace: WorkingTrace): string[] {
  if ('point' in trace && trace.point !== undefined && trace.point > 0)
    return withPoint(formatTrace({ ...trace, point: 0 }), trace.point);
  switch (trace.kind) {
    case 'column-addition': {
      const rows = trace.rows.map((r) => r.digits + ' '.repeat(r.shift));
      const width = Math.max(trace.result.length, ...rows.map((r) => r.length)) + 2;
      const carries = trace.columns.map((c) => c.carryIn).some((c) => c > 0)
        ? [
            `carries: ${trace.columns
              .filter((c) => c.carryIn > 0)
              .map((c) => `${c.carryIn} into the ${c.place}`)
              .join(', ')}`,
          ]
        : [];
      return [
        ...rows.map((r, i) => (i === rows.length - 1 ? `+${pad(r, width - 1)}` : pad(r, width))),
        '─'.repeat(width),
        pad(trace.result, width),
        ...carries,
      ];
    }
    case 'column-subtraction': {
      const bottom = trace.bottom.digits + ' '.repeat(trace.bottom.shift);
      const width = Math.max(trace.top.digits.length, bottom.length) + 2;
      const marks = trace.columns
        .filter((c) => c.marks.length > 1)
        .reverse()
        .map((c) => `${c.place} ${c.marks.join(' → ')}`);
      return [
        pad(trace.top.digits, width),
        `−${pad(bottom, width - 1)}`,
        '─'.repeat(width),
        pad(trace.result, width),
        ...(marks.length > 0 ? [`regrouping: ${marks.join('; ')}`] : []),
      ];
    }
    case 'long-multiplication': {
      const lines = [`${trace.top} × ${trace.bottom}`];
      if (trace.zeros !== null)
        lines.push(
          `zeros set aside: ${trace.zeros.top} + ${trace.zeros.bottom}, put back: ${trace.zeros.appended}`,
        );
      for (const p of trace.partials)
        lines.push(
          `  ${trace.top.replace(/0+$/, '') || trace.top} × ${p.multiplierDigit} = ${p.digits}${p.shift > 0 ? ` shifted ${p.shift} (${p.value})` : ''}`,
        );
      if (trace.sum !== null)
        lines.push(
          `  partial products added: ${trace.sum.rows.map((r) => r.digits).join(' + ')} = ${trace.sum.result}`,
        );
      lines.push(`= ${trace.result}`);
      return lines;
    }
    case 'long-division':
      return [
        `${trace.dividend} ÷ ${trace.divisor}`,
        ...trace.steps.map(
          (s) =>
            `  ${s.number} ÷ ${trace.divisor} → ${s.quotientDigit ?? '(nothing written)'}; ${s.quotientDigit ?? 0} × ${trace.divisor} = ${s.product}; ${s.number} − ${s.product} = ${s.difference}${s.broughtDown === null ? '' : `; bring down ${s.broughtDown}`}`,
        ),
        `= ${trace.result}`,
      ];
    case 'rounding':
      return [
        `${trace.value}: ${trace.place} digit ${trace.placeDigit}, deciding digit ${trace.decidingDigit} (${trace.decidingPlace})`,
        ...(trace.steps.length > 0 ? [`steps: ${trace.steps.join(' → ')}`] : []),
        trace.rule,
        `= ${trace.result}`,
      ];
    case 'missing-number':
      return [
        trace.equation,
        `  ${trace.inverse.a} ${trace.inverse.op} ${trace.inverse.b} = ${trace.inverse.result}`,
        `  check: ${trace.check}`,
        ...(trace.working === null ? [] : formatTrace(trace.working).map((l) => `  ${l}`)),
      ];
    case 'fraction-sum':
      return [
        `${trace.left.numerator}/${trace.left.denominator} ${trace.op} ${trace.right.numerator}/${trace.right.denominator}`,
        ...(trace.leftScaled !== null && trace.rightScaled !== null
          ? [
              `  over ${trace.commonDenominator}: ${trace.leftScaled.numerator}/${trace.leftScaled.denominator} ${trace.op} ${trace.rightScaled.numerator}/${trace.rightScaled.denominator}`,
            ]
          : []),
        `  = ${trace.unsimplified.numerator}/${trace.unsimplified.denominator}${trace.simplified.divisor > 1 ? ` = ${trace.simplified.numerator}/${trace.simplified.denominator}` : ''}${trace.mixed === null ? '' : ` = ${trace.mixed}`}`,
      ];
    case 'decimal-comparison':
      return [`${trace.left} ? ${trace.right}`, `  ${trace.basis}`, `= ${trace.result}`];
    case 'clock':
      return [
        `${trace.left} ${trace.op} ${trace.right}`,
        ...trace.steps.map((s) => `  ${s}`),
        `= ${trace.result}`,
      ];
    case 'fraction-comparison':
      return trace.basis === 'denominators'
        ? [
            `compared by the bottom numbers alone: ${trace.left.denominator} and ${trace.right.denominator}`,
            `= ${trace.result}`,
          ]
        : [
            `over ${trace.commonDenominator}: ${trace.leftScaled.numerator}/${trace.commonDenominator} and ${trace.rightScaled.numerator}/${trace.commonDenominator}`,
            `${trace.left.numerator}/${trace.left.denominator} ${trace.sign} ${trace.right.numerator}/${trace.right.denominator}`,
          ];
  }
}

/** Column lines with the point put back `places` digits from the right of every number row. */
function withPoint(lines: readonly string[], places: number): string[] {
  return lines.map((line) => {
    if (/^─+$/.test(line)) return `${line}─`;
    const m = /^([+−×\s]*)(\d+)(\s*)$/.exec(line);
    if (m === null) return line;
    const digits = (m[2] as string).padStart(places + 1, '0');
    const at = digits.length - places;
    return `${m[1]}${digits.slice(0, at)}.${digits.slice(at)}${m[3]}`;
  });
}

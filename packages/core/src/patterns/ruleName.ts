import { RULES, ruleInfo } from '../rules/catalog.js';

const TITLE_COUNT: ReadonlyMap<string, number> = RULES.reduce(
  (m, r) => m.set(r.title, (m.get(r.title) ?? 0) + 1),
  new Map<string, number>(),
);

/**
 * A rule's name for a reader, unique across the catalog: its title, with the operation
 * added where another rule has the same title. A pair's id (`a+b`) names both rules.
 * `ruleName('add.no-carry')` → `'Carry dropped (addition)'`; `ruleName('sub.borrow-across-zero')` → `'Zeros skipped when regrouping'`;
 * `ruleName('sub.borrow-from-zero+sub.fact')` → `'Zero changed to 9, regrouping stopped with one subtraction fact'`.
 */
export function ruleName(id: string): string {
  if (id.includes('+')) {
    // The second name goes on mid-sentence: "… stopped with one subtraction fact" ("N − 0 …" stays).
    const [first, ...rest] = id.split('+').map(ruleName);
    return [first, ...rest.map((n) => n.replace(/^[A-Z](?=[a-z])/, (c) => c.toLowerCase()))].join(
      ' with ',
    );
  }
  const info = ruleInfo(id);
  if (!info) return id;
  return (TITLE_COUNT.get(info.title) ?? 0) > 1 ? `${info.title} (${info.operation})` : info.title;
}

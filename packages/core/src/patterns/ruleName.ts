import { RULES, ruleInfo } from '../rules/catalog.js';

const TITLE_COUNT: ReadonlyMap<string, number> = RULES.reduce(
  (m, r) => m.set(r.title, (m.get(r.title) ?? 0) + 1),
  new Map<string, number>(),
);

/**
 * A rule's name for a reader, unique across the catalog: its title, with the operation
 * added where another rule has the same title. A pair's id (`a+b`) names both rules.
 * `ruleName('add.no-carry')` → `'Carry dropped (addition)'`; `ruleName('sub.borrow-across-zero')` → `'Zeros skipped when regrouping'`.
 */
export function ruleName(id: string): string {
  if (id.includes('+')) return id.split('+').map(ruleName).join(' with ');
  const info = ruleInfo(id);
  if (!info) return id;
  return (TITLE_COUNT.get(info.title) ?? 0) > 1 ? `${info.title} (${info.operation})` : info.title;
}

import { RULE_GROUPS, ruleInfo } from '@workback/core';

/** Why a pattern key cannot be noted on, or `null` when it is one GET /patterns could give. */
export function patternKeyProblem(key: string): string | null {
  const m = /^(rule|fact|skill|group):(.+)$/.exec(key);
  if (m === null) return 'patternKey must start with rule:, fact:, skill: or group:';
  const [, kind, id] = m as unknown as [string, string, string];
  if (kind === 'rule' && ruleInfo(id) === undefined)
    return `patternKey names no rule of the catalog (“${id}”)`;
  if (kind === 'fact' && !/^[+x]\d{1,3}$/.test(id))
    return 'patternKey must name a fact family such as fact:x7 or fact:+8';
  if (kind === 'group' && !RULE_GROUPS.some((g) => g.group === id))
    return `patternKey names no group of related rules (“${id}”)`;
  if (kind === 'skill' && !/^[\p{L}\p{N} ._-]{1,40}$/u.test(id))
    return 'patternKey must name a skill of up to 40 letters, digits, dots or dashes';
  return null;
}

/**
 * Where a miss is in the review loop: logged → discussed → planned → resolved.
 * `MissStatus.planned` → `'planned'`.
 */
export const MissStatus = {
  logged: 'logged',
  discussed: 'discussed',
  planned: 'planned',
  resolved: 'resolved',
} as const;
export type MissStatus = (typeof MissStatus)[keyof typeof MissStatus];

export const MISS_STATUSES: readonly MissStatus[] = Object.values(MissStatus);

export const MISS_STATUS_LABEL: Readonly<Record<MissStatus, string>> = {
  logged: 'Logged',
  discussed: 'Talked through',
  planned: 'On a review plan',
  resolved: 'Resolved',
};

/** `isMissStatus('resolved')` → `true`. */
export function isMissStatus(value: unknown): value is MissStatus {
  return typeof value === 'string' && (MISS_STATUSES as readonly string[]).includes(value);
}

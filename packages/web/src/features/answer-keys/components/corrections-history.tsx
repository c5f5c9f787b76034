import type { KeyCorrection } from '../types';

const FIELD_LABEL: Readonly<Record<string, string>> = {
  number: 'number',
  prompt: 'problem',
  answer: 'answer',
  skills: 'skills',
  revisit: 'lessons to revisit',
  facts: 'fact family',
  removed: 'removed',
};

const show = (value: unknown) =>
  Array.isArray(value)
    ? value.join('; ') || '(none)'
    : value === null || value === undefined || value === ''
      ? '(none)'
      : String(value);

const when = (iso: string) =>
  new Date(iso).toLocaleString(undefined, {
    day: 'numeric',
    month: 'short',
    year: 'numeric',
    hour: '2-digit',
    minute: '2-digit',
  });

/** Every correction of a key made after it had sittings: what changed, why, when, by whom. */
export function CorrectionsHistory({ corrections }: { corrections: readonly KeyCorrection[] }) {
  if (corrections.length === 0) {
    return (
      <p className="wb-muted">
        No corrections yet. Once a key has sittings, each change is kept here with its reason.
      </p>
    );
  }
  const newestFirst = [...corrections].reverse();
  return (
    <ol className="wb-history" aria-label="Corrections">
      {newestFirst.map((correction) => (
        <li key={correction.id}>
          <p className="wb-history-what">
            <strong>Item {correction.itemNumber}</strong>
            {Object.entries(correction.changes).map(([field, change]) =>
              field === 'removed' ? (
                <span key={field}> — removed (it was {show(change.from)})</span>
              ) : (
                <span key={field}>
                  {' '}
                  — {FIELD_LABEL[field] ?? field}: <s className="wb-digits">{show(change.from)}</s>{' '}
                  → <span className="wb-digits">{show(change.to)}</span>
                </span>
              ),
            )}
          </p>
          <p className="wb-history-why">“{correction.reason}”</p>
          <p className="wb-muted">
            {correction.madeBy.name}, {when(correction.createdAt)}
            {correction.remarkedSittingIds.length > 0
              ? ` · re-marked ${correction.remarkedSittingIds.length} sitting${correction.remarkedSittingIds.length === 1 ? '' : 's'}`
              : ''}
          </p>
        </li>
      ))}
    </ol>
  );
}

import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';

import { isApiError } from '../../lib/api-client';

/**
 * Puts the API's per-field messages next to their fields; returns the message for the whole form
 * (or `null` when every problem belongs to a field).
 */
export function applyFieldErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  fieldNames: readonly Path<T>[],
  fallback = 'Something went wrong. Please try again.',
): string | null {
  if (!isApiError(error)) return fallback;
  const known = Object.entries(error.fields).filter(([name]) =>
    (fieldNames as readonly string[]).includes(name),
  );
  for (const [name, message] of known) {
    setError(name as Path<T>, { type: 'server', message });
  }
  const unplaced = Object.keys(error.fields).length > known.length;
  if (known.length > 0 && !unplaced) return null;
  return error.message || fallback;
}

/**
 * The engine and catalog version stored with every diagnosis, so stored diagnoses can be
 * recomputed when the methods or the catalog change (the last number moves when only the
 * words do: 1.1.2 tells a rule with a slip as one story and writes thousands with commas).
 * `ENGINE_VERSION` → `'core-1.1.2+catalog-1'`.
 */
export const ENGINE_VERSION = 'core-1.1.2+catalog-1';

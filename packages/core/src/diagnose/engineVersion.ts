/**
 * The engine and catalog version stored with every diagnosis, so stored diagnoses can be
 * recomputed when the methods or the catalog change.
 * `ENGINE_VERSION` → `'core-1.1.1+catalog-1'`.
 */
export const ENGINE_VERSION = 'core-1.1.1+catalog-1';

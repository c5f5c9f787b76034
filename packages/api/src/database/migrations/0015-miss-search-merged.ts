import type { QueryInterface } from 'sequelize';
import { mergeSearchIndex } from '../search-index.js';

export const name = '0015-miss-search-merged';

/**
 * Merges the SQLite text index that migration 0014 rebuilt in one statement, before a write
 * under load has to (`mergeSearchIndex`). Nothing to undo: the same entries, in fewer segments.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await mergeSearchIndex(qi.sequelize);
}

export async function down(): Promise<void> {}

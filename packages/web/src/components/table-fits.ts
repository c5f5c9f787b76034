import { useMediaQuery } from '../lib/use-media-query';

/** Below this width most lists' tables would scroll sideways, so they show cards instead. */
export const TABLE_FITS_QUERY = '(min-width: 1041px)';

/**
 * `useTableFits()` → `true` on a wide screen (table), `false` on a phone (cards). Kept apart from
 * `ListTable` so a page can choose without loading the table component on a phone.
 */
export function useTableFits(query: string = TABLE_FITS_QUERY): boolean {
  return useMediaQuery(query);
}

import { paths } from '../../config/paths';

/** What the Notebook page filters by, under the names it reads from the address bar. */
export type NotebookFilter = {
  studentId: number;
  cause?: string;
  rule?: string;
  skill?: string;
  from?: string | null;
  to?: string | null;
};

/** `notebookHref({ studentId: 2, rule: 'sub.borrow-across-zero' })` → `/notebook?student=2&rule=…`. */
export function notebookHref(filter: NotebookFilter): string {
  const search = new URLSearchParams();
  search.set('student', String(filter.studentId));
  if (filter.cause) search.set('cause', filter.cause);
  if (filter.rule) search.set('rule', filter.rule);
  if (filter.skill) search.set('skill', filter.skill);
  if (filter.from) search.set('from', filter.from);
  if (filter.to) search.set('to', filter.to);
  return paths.app.notebook.getHref(search.toString());
}

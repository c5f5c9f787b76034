import { Op, type WhereOptions } from 'sequelize';
import type { MemberContext } from '../common/member-context.js';
import { placeholders, type SqlParam } from '../database/sql-reader.js';
import type { Miss } from './models/miss.model.js';

/** The misses a member may see: the household's, and for a tutor only the granted students'. */
export function missScope(member: MemberContext): WhereOptions<Miss> {
  return member.studentIds === null
    ? { householdId: member.householdId }
    : { householdId: member.householdId, studentId: { [Op.in]: member.studentIds } };
}

/** `missScope` as SQL for SqlReader, on the `misses` table's own columns. */
export function missScopeSql(member: MemberContext): { sql: string; params: SqlParam[] } {
  const ids = member.studentIds;
  if (ids === null) return { sql: '"household_id" = ?', params: [member.householdId] };
  // A tutor granted no student sees no miss.
  if (ids.length === 0) return { sql: '1 = 0', params: [] };
  return {
    sql: `"household_id" = ? AND "student_id" IN (${placeholders(ids.length)})`,
    params: [member.householdId, ...ids],
  };
}

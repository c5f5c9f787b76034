import { Op, type WhereOptions } from 'sequelize';
import type { MemberContext } from '../common/member-context.js';
import type { Miss } from './models/miss.model.js';

/** The misses a member may see: the household's, and for a tutor only the granted students'. */
export function missScope(member: MemberContext): WhereOptions<Miss> {
  return member.studentIds === null
    ? { householdId: member.householdId }
    : { householdId: member.householdId, studentId: { [Op.in]: member.studentIds } };
}

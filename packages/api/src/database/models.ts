import { Household } from '../households/models/household.model.js';
import { Membership } from '../households/models/membership.model.js';
import { StudentGrant } from '../households/models/student-grant.model.js';
import { Student } from '../students/models/student.model.js';
import { User } from '../users/models/user.model.js';

/** Every Sequelize model, registered once on the connection. */
export const MODELS = [User, Household, Membership, StudentGrant, Student];

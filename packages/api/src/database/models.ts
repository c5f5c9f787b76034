import { AnswerKey } from '../answer-keys/models/answer-key.model.js';
import { KeyCorrection } from '../answer-keys/models/key-correction.model.js';
import { KeyItem } from '../answer-keys/models/key-item.model.js';
import { CheckUp } from '../check-ups/models/check-up.model.js';
import { Course } from '../curriculum/models/course.model.js';
import { EmailVerificationToken } from '../email-verifications/models/email-verification-token.model.js';
import { Lesson } from '../curriculum/models/lesson.model.js';
import { Household } from '../households/models/household.model.js';
import { Membership } from '../households/models/membership.model.js';
import { StudentGrant } from '../households/models/student-grant.model.js';
import { MissDiagnosis } from '../misses/models/miss-diagnosis.model.js';
import { MissRule } from '../misses/models/miss-rule.model.js';
import { Miss } from '../misses/models/miss.model.js';
import { Note } from '../notes/models/note.model.js';
import { Invitation } from '../invitations/models/invitation.model.js';
import { PatternNote } from '../patterns/models/pattern-note.model.js';
import { PasswordResetToken } from '../password-resets/models/password-reset-token.model.js';
import { PhotoMark } from '../photos/models/photo-mark.model.js';
import { Photo } from '../photos/models/photo.model.js';
import { SittingMark } from '../sittings/models/sitting-mark.model.js';
import { Sitting } from '../sittings/models/sitting.model.js';
import { ReviewPlanItemMiss } from '../review-plans/models/review-plan-item-miss.model.js';
import { ReviewPlanItem } from '../review-plans/models/review-plan-item.model.js';
import { ReviewPlan } from '../review-plans/models/review-plan.model.js';
import { Student } from '../students/models/student.model.js';
import { User } from '../users/models/user.model.js';

/** Every Sequelize model, registered once on the connection. */
export const MODELS = [
  User,
  Household,
  Membership,
  StudentGrant,
  Student,
  Invitation,
  PasswordResetToken,
  EmailVerificationToken,
  Miss,
  MissRule,
  MissDiagnosis,
  Photo,
  PhotoMark,
  Note,
  Course,
  Lesson,
  AnswerKey,
  KeyItem,
  KeyCorrection,
  Sitting,
  SittingMark,
  CheckUp,
  ReviewPlan,
  ReviewPlanItem,
  ReviewPlanItemMiss,
  PatternNote,
];

// Public contract of @workback/core: explicit named exports only.
export { Role, ROLES, EDITOR_ROLES, isRole } from './domain/roles.js';
export { Cause, CAUSES, CAUSE_GUIDE, isCause } from './domain/causes.js';
export { MissStatus, MISS_STATUSES, MISS_STATUS_LABEL, isMissStatus } from './domain/statuses.js';
export { GRADE_LEVELS, isGradeLevel } from './domain/grades.js';
export { MissKind, MISS_KINDS, MISS_KIND_LABEL, isMissKind } from './domain/missKinds.js';

// Parsing
export { parseProblem } from './parse/parseProblem.js';
export { parseAnswer } from './parse/parseAnswer.js';
export { missKindOf } from './parse/missKindOf.js';
export { groupThousands } from './numbers/groupThousands.js';
export type {
  Problem,
  ProblemKind,
  Answer,
  Fraction,
  RoundingPlace,
  ReadError,
  ParsedProblem,
  ParsedAnswer,
} from './parse/types.js';
export { Operation } from './parse/types.js';

// Written methods (the reference workings and their variants)
export { addColumns } from './addition/addColumns.js';
export type { AdditionMethod, AdditionRun, CarryHabit } from './addition/addColumns.js';
export { subtractColumns } from './subtraction/subtractColumns.js';
export type { SubtractionMethod, SubtractionRun } from './subtraction/subtractColumns.js';
export { multiplyLong } from './multiplication/multiplyLong.js';
export type {
  MultiplicationMethod,
  MultiplicationRun,
  ProductCarry,
} from './multiplication/multiplyLong.js';
export { multiplyWithZerosSetAside } from './multiplication/multiplyWithZerosSetAside.js';
export { divideLong } from './division/divideLong.js';
export type { DivisionMethod, DivisionRun } from './division/divideLong.js';
export { divideDigitByDigit } from './division/divideDigitByDigit.js';
export { roundToPlace } from './rounding/roundToPlace.js';
export type { RoundingHabit } from './rounding/roundToPlace.js';
export { solveMissing } from './missing/solveMissing.js';
export { addFractions } from './fractions/addFractions.js';
export type { FractionHabit } from './fractions/addFractions.js';
export { compareFractions } from './fractions/compareFractions.js';

// Working traces
export type {
  WorkingTrace,
  WorkingTraceKind,
  Row,
  AdditionColumn,
  ColumnAdditionTrace,
  SubtractionColumn,
  Regrouping,
  ColumnSubtractionTrace,
  ProductCell,
  PartialProduct,
  LongMultiplicationTrace,
  DivisionStep,
  LongDivisionTrace,
  RoundingTrace,
  MissingNumberTrace,
  ScaledFraction,
  FractionSumTrace,
  FractionComparisonTrace,
} from './trace/types.js';

// Error rules
export { RULES, ruleInfo } from './rules/catalog.js';
export type { RuleInfo } from './rules/catalog.js';
export { applyRule } from './rules/applyRule.js';

// Diagnosis
export { diagnose } from './diagnose/diagnose.js';
export { suggestCause } from './diagnose/suggestCause.js';
export { ENGINE_VERSION } from './diagnose/engineVersion.js';
export type {
  Diagnosis,
  DiagnoseResult,
  Unreadable,
  RuleMatch,
  FactError,
  FirstWrongStep,
  WrittenSteps,
  WrittenStepCheck,
  WrittenStepsReport,
  SuggestedCause,
} from './diagnose/types.js';

// Checks
export { castOutNines } from './checks/castOutNines.js';
export { castOutElevens } from './checks/castOutElevens.js';
export type { CheckResult, ResidueWorking } from './checks/types.js';

// Practice
export { practiceFor } from './practice/practiceFor.js';
export type { PracticeProblem, PracticeSet } from './practice/practiceFor.js';

// Check-ups: a few problems that tell the possible explanations apart
export { planCheckUp } from './checkup/planCheckUp.js';
export { readCheckUp } from './checkup/readCheckUp.js';
export { RIGHT_WORKING } from './checkup/types.js';
export type {
  CheckUpPlan,
  CheckUpProblem,
  CheckUpReading,
  HypothesisScore,
  MergedCandidate,
} from './checkup/types.js';

// Word problems: the child's number sentences, line by line
export { checkLines } from './lines/checkLines.js';
export type { CheckedLine, CheckedLines } from './lines/checkLines.js';
export { InterviewStage, INTERVIEW_STAGES, INTERVIEW_STAGE_GUIDE } from './lines/stages.js';
export { lineVerdict } from './lines/lineVerdict.js';
export { suggestStageCause } from './lines/suggestStageCause.js';
export type { StageSuggestion } from './lines/suggestStageCause.js';

// Patterns across a student's misses
export { computePatterns } from './patterns/computePatterns.js';
export { causeMixByWeek } from './patterns/causeMixByWeek.js';
export { countRules } from './patterns/countRules.js';
export { countSkills } from './patterns/countSkills.js';
export { factGaps } from './patterns/factGaps.js';
export { findRecurring } from './patterns/findRecurring.js';
export type { RecurringOptions } from './patterns/findRecurring.js';
export { rankFindings } from './patterns/rankFindings.js';
export { RULE_GROUPS } from './patterns/ruleGroups.js';
export { patternKeysOf } from './patterns/patternKeysOf.js';
export { factFamiliesOf } from './patterns/factFamiliesOf.js';
export { factFamilyLabel } from './patterns/factFamilyLabel.js';
export { factText } from './patterns/factText.js';
export { ruleName } from './patterns/ruleName.js';
export { groupDifficulties } from './patterns/groupDifficulties.js';
export { isoWeekOf } from './patterns/isoWeekOf.js';
export type { IsoWeek } from './patterns/isoWeekOf.js';
export type {
  StoredDiagnosis,
  PatternMiss,
  RightItem,
  ReviewedPlan,
  BasicFact,
  Seen,
  WeekCauseMix,
  RuleCount,
  SkillCount,
  FactCount,
  FamilyCount,
  FactGaps,
  PatternKind,
  SincePlan,
  RecurringPattern,
  MissEvidence,
  Contradiction,
  RuleFinding,
  FindingGroup,
  Findings,
  Difficulty,
  Patterns,
} from './patterns/types.js';

// Plain-text drawing of a working (the CLI's, also used for printing)
export { formatTrace } from './cli/formatTrace.js';

// Review plans
export { buildReviewPlan } from './plans/buildReviewPlan.js';
export type { ReviewPlanOptions } from './plans/buildReviewPlan.js';
export { lessonRanges } from './plans/lessonRanges.js';
export { formatLessonRanges } from './plans/formatLessonRanges.js';
export { PRACTICE_ACTIVITIES } from './plans/practiceActivities.js';
export { suggestActivity } from './plans/suggestActivity.js';
export { activitiesFor } from './plans/activitiesFor.js';
export { chooseFocus, difficultyOf } from './plans/chooseFocus.js';
export { lessonTitle } from './plans/buildReviewPlan.js';
export { seedOf } from './plans/seedOf.js';
export type {
  PlanMiss,
  LessonRange,
  PracticeActivity,
  FactFamilyDrill,
  PracticeBlock,
  PlanItemKind,
  PlanItemDraft,
  ReviewPlanDraft,
  PlanLesson,
  FocusProblem,
  PlanSummary,
} from './plans/types.js';

// Answer keys: the key CSV's rules (the browser's preview and the API's import) and lessons to revisit.
export { readKeyCsv, KEY_CSV_COLUMNS, MAX_KEY_ITEMS } from './keys/readKeyCsv.js';
export type {
  KeyCsvColumn,
  KeyCsvParseOptions,
  KeyCsvProblem,
  KeyCsvRead,
  KeyCsvRow,
  ParseCsv,
} from './keys/readKeyCsv.js';
export { readRevisit } from './keys/readRevisit.js';
export type { RevisitRead } from './keys/readRevisit.js';
export { revisitLessons } from './keys/revisitLessons.js';

// Trade maths shared by browser and server: e1RM, units, bar loading, warm-ups, weight classes, DOTS, RPE, meet day.

export {
  E1RM_FORMULAS,
  E1RM_FORMULA_LABELS,
  E1RM_MAX_REPS,
  estimateOneRepMax,
  estimateOneRepMaxAtRpe,
  type E1rmFormula,
} from './e1rm';
export { KG_PER_LB, WEIGHT_UNITS, formatWeight, fromKg, kgToLb, lbToKg, toKg, type WeightUnit } from './units';
export {
  DEFAULT_BAR_SETUP,
  PLATE_COLOURS,
  isLoadable,
  loadBar,
  loadableBelow,
  plateColour,
  roundToLoadable,
  type BarLoad,
  type BarOptions,
  type BarSetup,
  type PlateColour,
  type PlateSet,
  type RoundMode,
} from './plates';
export { DEFAULT_WARMUP_STEPS, LAST_WARMUP_FRACTION, MAX_WARMUP_STEPS, warmupRamp, type WarmupStep } from './warmup';
export { DIVISIONS, WEIGHT_CLASSES, dotsScore, weightClass, type Division, type Sex } from './classes';
export { RPE_MAX, RPE_MIN, RPE_VALUES, assertRpe, isValidRpe, rirToRpe, rpeToRir } from './rpe';
export {
  AGE_GROUPS,
  AGE_GROUP_LABELS,
  ATTEMPT_STEP_KG,
  EQUIPMENT,
  GL_MIN_BODYWEIGHT_KG,
  MAX_ATTEMPT_KG,
  MEET_LIFTS,
  MEET_EVENTS,
  MIN_COMPETITION_AGE,
  MIN_INCREASE_KG,
  RECORD_STEP_KG,
  ageGroup,
  attemptChoices,
  attemptProblem,
  bestGood,
  classDivision,
  classLimitKg,
  glPoints,
  nextAttemptOptions,
  nextOffer,
  standingOf,
  type AgeGroup,
  type AttemptOptions,
  type Equipment,
  type JudgedAttempt,
  type MeetEvent,
  type MeetLift,
  type NextOffer,
  type Standing,
  type PreviousAttempt,
} from './meet';

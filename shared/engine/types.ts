// Types of the rotation engine's public contract, shared by browser and server.

export type Lift = 'squat' | 'bench' | 'deadlift';
export type Joint = 'shoulder' | 'elbow' | 'wrist' | 'lowerBack' | 'hip' | 'knee';
export type RiskTier = 1 | 2 | 3; // 1 low … 3 high
export type Emphasis = 'bottom' | 'midRange' | 'lockout';
export type RuleId =
  | 'repeat'
  | 'family'
  | 'jointBudget'
  | 'taperRisk'
  | 'taperSpecificity'
  | 'restriction'
  | 'equipment'
  | 'liftMismatch'
  | 'unknownVariant'
  // version 2
  | 'meetPhase'
  | 'archived'
  | 'riskCeiling'
  | 'restWeek';

export const LIFTS: readonly Lift[] = ['squat', 'bench', 'deadlift'];
export const JOINTS: readonly Joint[] = ['shoulder', 'elbow', 'wrist', 'lowerBack', 'hip', 'knee'];
export const RULE_IDS: readonly RuleId[] = [
  'repeat',
  'family',
  'jointBudget',
  'taperRisk',
  'taperSpecificity',
  'restriction',
  'equipment',
  'liftMismatch',
  'unknownVariant',
  'meetPhase',
  'archived',
  'riskCeiling',
  'restWeek',
];

export interface Variant {
  id: string;
  name: string;
  lift: Lift;
  family: string;
  risk: RiskTier;
  specificity: number; // 0..1: closeness to the competition lift
  stress: Partial<Record<Joint, number>>; // 0..3 per joint; absent = 0
  equipment: string[]; // all must be available to the athlete
  /** Optional soft-goal tags: the part of the range the variant overloads, and the bar used. */
  emphasis?: Emphasis;
  bar?: string;
  /** Never picked; a planned one is swapped (rule 'archived'), a pinned one reported. */
  archived?: boolean;
  /** Only when 0 <= weeks to the athlete's meet <= this (meet rehearsals, openers); rule 'meetPhase'. */
  meetPhaseWeeks?: number;
}
export interface SlotDef {
  id: string;
  lifts: Lift[];
} // which lifts may fill this slot
export interface PlanEntry {
  athleteId: string;
  week: string;
  slotId: string;
  variantId: string;
  pinned?: boolean;
}
/**
 * A restriction (version 2). At least one of joint+maxStress, emphasis or families is given.
 * The version-1 shape { joint, maxStress } stays valid.
 */
export interface Restriction {
  joint?: Joint;
  maxStress?: number; // variant.stress[joint] <= maxStress
  emphasis?: Emphasis[]; // no variant with one of these emphases
  families?: string[]; // no variant of these families
  fromWeek?: string; // ISO weeks it covers, inclusive; absent = open-ended
  toWeek?: string;
}
export interface AthleteInput {
  id: string;
  equipment: string[];
  restrictions: Restriction[];
  meetWeek?: string; // ISO week of the next meet, '2027-W14'
  history: PlanEntry[]; // weeks already trained
  /** This athlete's risk ceiling (rule 'riskCeiling'), e.g. 2 for a newer lifter. */
  maxRisk?: RiskTier;
  /** Deload or rest weeks: no max-effort pick at all. */
  restWeeks?: string[];
}
export interface TaperRule {
  weeksOut: number;
  maxRisk: RiskTier;
  minSpecificity?: number;
}
export interface Rules {
  repeatWindowWeeks: number; // any span of this many consecutive weeks holds a variant at most once
  familyWindowWeeks: number; // any span of this many consecutive weeks holds a family at most once
  jointWindowWeeks: number; // span length for joint budgets
  jointBudget: Partial<Record<Joint, number>>; // per joint: summed stress in any span <= budget
  taper: TaperRule[];
  seed: string;
  /** Default 0.8: joint load at or under this share of budget is "comfortable". */
  comfortRatio?: number;
  /** A slot with several lifts holds each of them at least once in any span this long. */
  liftBalanceWeeks?: number;
}
export interface PlanRequest {
  variants: Variant[];
  slots: SlotDef[];
  athletes: AthleteInput[];
  rules: Rules;
  weeks: string[]; // consecutive ISO weeks to fill, oldest first
  planned?: PlanEntry[]; // what is on the board already for those weeks
}
export interface PlanResult {
  entries: (PlanEntry & { reasons: string[] })[]; // one per athlete × week × slot that could be filled
  unfilled: {
    athleteId: string;
    week: string;
    slotId: string;
    blockedBy: RuleId[];
    /** The unpinned board entry that had to go from this cell (and why) when nothing valid could replace it. */
    dropped?: { variantId: string; rule: RuleId; message: string };
  }[];
  swaps: { athleteId: string; week: string; slotId: string; from: string; to: string; rule: RuleId }[];
  /** Unpinned planned entries removed from rest weeks. */
  cleared: { athleteId: string; week: string; slotId: string; variantId: string; rule: 'restWeek' }[];
}
export interface Violation {
  rule: RuleId;
  athleteId: string;
  week: string;
  slotId: string;
  variantId: string;
  message: string;
}

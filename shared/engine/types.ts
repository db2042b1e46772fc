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
  | 'unknownVariant';

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
export interface AthleteInput {
  id: string;
  equipment: string[];
  restrictions: { joint: Joint; maxStress: number }[]; // variant.stress[joint] must be <= maxStress
  meetWeek?: string; // ISO week of the next meet, '2027-W14'
  history: PlanEntry[]; // weeks already trained
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
}
export interface Violation {
  rule: RuleId;
  athleteId: string;
  week: string;
  slotId: string;
  variantId: string;
  message: string;
}

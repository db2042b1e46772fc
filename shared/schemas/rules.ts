// Team rules: max-effort slots, rotation windows, joint budgets, taper steps and the gym's equipment.
import { z } from 'zod';
import { BACK_OFF_DROP_MAX, BACK_OFF_DROP_MIN, BACK_OFF_SETS_MAX, DEFAULT_BACK_OFF } from '../calc/loads';
import { DEFAULT_ACCESSORY_ROTATION } from '../engine/accessories';
import { DEFAULT_TISSUE_RULES, HIGH_REP_FLOOR } from '../engine/tissue';
import { DEFAULT_SESSIONS, defaultSessionsFor, sessionsSchema } from './week';

export const liftSchema = z.enum(['squat', 'bench', 'deadlift']);
export const jointSchema = z.enum(['shoulder', 'elbow', 'wrist', 'lowerBack', 'hip', 'knee']);
export const riskSchema = z.union([z.literal(1), z.literal(2), z.literal(3)]);

export const slotSchema = z.object({
  id: z
    .string()
    .trim()
    .regex(/^[a-z][a-z0-9-]{0,31}$/, 'Use lower-case letters, digits and dashes, starting with a letter'),
  label: z.string().trim().min(1, 'Give the slot a name').max(40),
  lifts: z.array(liftSchema).min(1, 'Pick at least one lift'),
});

export const taperStepSchema = z.object({
  weeksOut: z.number().int().min(0).max(16),
  maxRisk: riskSchema,
  minSpecificity: z.number().min(0).max(1).optional(),
});

export const jointBudgetSchema = z.partialRecord(jointSchema, z.number().min(0).max(60));

/** The most reps of high-rep work a team may set (our choice: beyond this a session is too long to be light). */
const HIGH_REP_MAX = 300;

/** The connective-tissue settings a coach edits; the rest of the tissue module's rules keep their defaults. */
export const tissueSettingsSchema = z.object({
  maxConsecutiveWeeks: z.number().int().min(1, 'At least 1 week').max(12),
  pullIsometricWeeksOut: z.number().int().min(-1).max(16),
  pullStretchWeeksOut: z.number().int().min(-1).max(16),
  sorenessThreshold: z.number().int().min(1).max(10),
  /** The reps of high-rep light work; soreness lowers the band, never the reps. */
  highRepMinReps: z
    .number({ message: 'Enter a number of reps' })
    .int('Use whole reps')
    .min(HIGH_REP_FLOOR, `High-rep work is ${HIGH_REP_FLOOR} reps or more: use at least ${HIGH_REP_FLOOR}`)
    .max(HIGH_REP_MAX, `Use at most ${HIGH_REP_MAX} reps`),
  /** Sessions of tissue work in a week. */
  sessionsPerWeek: z
    .number({ message: 'Enter a number of sessions' })
    .int('Use whole sessions')
    .min(1, 'At least 1 session a week')
    .max(7, 'At most 7 sessions a week'),
  focusJoints: z.array(jointSchema).max(6),
});
export type TissueSettings = z.infer<typeof tissueSettingsSchema>;

/**
 * Stored tissue settings are read forgivingly: a setting added later reads as its default, and reps saved
 * when fewer than 100 were allowed are clamped up to 100 on read (into range), so those teams' rules still
 * load instead of falling back to the defaults; the next save stores the clamped value.
 */
const storedTissueSettingsSchema = tissueSettingsSchema.extend({
  highRepMinReps: z
    .number()
    .int()
    .default(DEFAULT_TISSUE_RULES.highRepMinReps)
    .transform((n) => Math.min(HIGH_REP_MAX, Math.max(HIGH_REP_FLOOR, n))),
  sessionsPerWeek: tissueSettingsSchema.shape.sessionsPerWeek.default(DEFAULT_TISSUE_RULES.sessionsPerWeek),
});

/** Back-off sets after each max-effort top set: 0–5 sets, 5–25 % lighter (see the limits in the maths). */
export const backOffRuleSchema = z.object({
  sets: z
    .number({ message: 'Enter a number of sets (0 for none)' })
    .int('Use whole sets')
    .min(0, 'Use 0 for no back-off sets')
    .max(BACK_OFF_SETS_MAX, `At most ${BACK_OFF_SETS_MAX} back-off sets`),
  dropPct: z
    .number({ message: `Enter a percentage from ${BACK_OFF_DROP_MIN} to ${BACK_OFF_DROP_MAX}` })
    .int('Use a whole percentage')
    .min(BACK_OFF_DROP_MIN, `Use ${BACK_OFF_DROP_MIN} to ${BACK_OFF_DROP_MAX} %`)
    .max(BACK_OFF_DROP_MAX, `Use ${BACK_OFF_DROP_MIN} to ${BACK_OFF_DROP_MAX} %`),
});

/** The most weeks an accessory block may last (our choice: accessories change every few weeks). */
export const ACCESSORY_BLOCK_MAX = 8;
export const ACCESSORY_REPEAT_MAX = 26;

/**
 * How the accessories rotate: the same ones for a block of weeks, and none of them back within the repeat
 * window. A window shorter than a block is refused: it would reach back less than one block, so it keeps out
 * only the last block's accessories, the same as a window of one block.
 */
const accessoryRotationShape = {
  blockWeeks: z
    .number({ message: 'Enter a number of weeks' })
    .int('Use whole weeks')
    .min(1, 'At least 1 week')
    .max(ACCESSORY_BLOCK_MAX, `At most ${ACCESSORY_BLOCK_MAX} weeks`),
  repeatWindowWeeks: z
    .number({ message: 'Enter a number of weeks' })
    .int('Use whole weeks')
    .min(1, 'At least 1 week')
    .max(ACCESSORY_REPEAT_MAX, `At most ${ACCESSORY_REPEAT_MAX} weeks`),
};
function windowCoversBlock(r: { blockWeeks: number; repeatWindowWeeks: number }, ctx: z.RefinementCtx) {
  if (r.repeatWindowWeeks < r.blockWeeks)
    ctx.addIssue({
      code: 'custom',
      path: ['repeatWindowWeeks'],
      message: `At least one block (${r.blockWeeks} weeks): a shorter window keeps out only the last block's accessories`,
    });
}
export const accessoryRotationSchema = z.object(accessoryRotationShape).superRefine(windowCoversBlock);
export type AccessoryRotationSettings = z.infer<typeof accessoryRotationSchema>;

const teamRulesShape = {
  slots: z.array(slotSchema).min(1, 'Keep at least one max-effort slot').max(4),
  repeatWindowWeeks: z.number().int().min(1, 'At least 1 week').max(26),
  familyWindowWeeks: z.number().int().min(1, 'At least 1 week').max(26),
  jointWindowWeeks: z.number().int().min(1, 'At least 1 week').max(12),
  jointBudget: jointBudgetSchema,
  taper: z.array(taperStepSchema).max(8),
  /** Share of a joint's budget the planner treats as comfortable and keeps under whenever it can. */
  comfortRatio: z
    .number({ message: 'Enter a share from 0.5 to 1' })
    .min(0.5, 'Use 0.5 to 1')
    .max(1, 'Use 0.5 to 1')
    .refine((n) => Math.abs(n * 100 - Math.round(n * 100)) < 1e-6, 'Use at most two decimals'),
  /** A slot with several lifts holds each of them at least once in any span of this many weeks. */
  liftBalanceWeeks: z
    .number({ message: 'Enter a number of weeks' })
    .int('Use whole weeks')
    .min(2, 'At least 2 weeks')
    .max(12),
  /** Bodyweight gained over the last 7 days before a meet that earns a caution, in kg (common practice). */
  bodyweightGainCautionKg: z.number().min(0.1).max(10),
  tissue: tissueSettingsSchema,
  /** The week's sessions in order of the week: what each holds and on which day. */
  sessions: sessionsSchema,
  backOff: backOffRuleSchema,
  accessoryRotation: accessoryRotationSchema,
};

function distinctSlots(
  r: { slots: { id: string }[]; sessions: { id: string; slotId: string | null }[] },
  ctx: z.RefinementCtx,
) {
  const ids = new Set<string>();
  r.slots.forEach((s, i) => {
    if (ids.has(s.id))
      ctx.addIssue({ code: 'custom', path: ['slots', i, 'id'], message: 'Slot ids must be different' });
    ids.add(s.id);
  });
  const sessionIds = new Set<string>();
  r.sessions.forEach((s, i) => {
    if (sessionIds.has(s.id))
      ctx.addIssue({ code: 'custom', path: ['sessions', i, 'id'], message: 'Session ids must be different' });
    sessionIds.add(s.id);
    if (s.slotId && !ids.has(s.slotId))
      ctx.addIssue({ code: 'custom', path: ['sessions', i, 'slotId'], message: 'Pick one of the max-effort slots' });
  });
}

/** The rules a coach sends: a field the product does not know is refused, not silently dropped. */
export const teamRulesSchema = z
  .strictObject({
    ...teamRulesShape,
    tissue: tissueSettingsSchema.strict(),
    backOff: backOffRuleSchema.strict(),
    accessoryRotation: z.strictObject(accessoryRotationShape).superRefine(windowCoversBlock),
  })
  .superRefine(distinctSlots);
/**
 * Stored rules are read forgivingly: a field left from an older version is ignored, a setting added later
 * (absent) reads its default, and a back-off or accessory setting that no longer validates reads its default
 * rather than losing the team's other rules.
 */
const storedTeamRulesSchema = z
  .object({
    ...teamRulesShape,
    tissue: storedTissueSettingsSchema,
    backOff: backOffRuleSchema.catch({ ...DEFAULT_BACK_OFF }),
    accessoryRotation: accessoryRotationSchema.catch({ ...DEFAULT_ACCESSORY_ROTATION }),
  })
  .superRefine(distinctSlots);
export type TeamRules = z.infer<typeof teamRulesSchema>;

export const equipmentListSchema = z
  .array(z.string().trim().min(1).max(40))
  .max(60)
  .transform((list) => [...new Set(list)]);

export const DEFAULT_TEAM_RULES: TeamRules = {
  slots: [
    { id: 'lower', label: 'Lower max effort', lifts: ['squat', 'deadlift'] },
    { id: 'upper', label: 'Upper max effort', lifts: ['bench'] },
  ],
  repeatWindowWeeks: 6,
  familyWindowWeeks: 2,
  jointWindowWeeks: 4,
  jointBudget: { shoulder: 9, elbow: 8, wrist: 8, lowerBack: 9, hip: 10, knee: 10 },
  taper: [
    { weeksOut: 3, maxRisk: 2 },
    { weeksOut: 1, maxRisk: 1, minSpecificity: 0.8 },
  ],
  // Common practice, no published source: keep a joint at or under four fifths of its budget when the
  // library allows, and rotate a squat-or-pull slot so each lift comes up at least every three weeks.
  comfortRatio: 0.8,
  liftBalanceWeeks: 3,
  bodyweightGainCautionKg: 2,
  tissue: {
    maxConsecutiveWeeks: DEFAULT_TISSUE_RULES.maxConsecutiveWeeks,
    pullIsometricWeeksOut: DEFAULT_TISSUE_RULES.pullIsometricWeeksOut,
    pullStretchWeeksOut: DEFAULT_TISSUE_RULES.pullStretchWeeksOut,
    sorenessThreshold: DEFAULT_TISSUE_RULES.sorenessThreshold,
    highRepMinReps: DEFAULT_TISSUE_RULES.highRepMinReps,
    sessionsPerWeek: DEFAULT_TISSUE_RULES.sessionsPerWeek,
    focusJoints: ['elbow', 'knee', 'shoulder'],
  },
  sessions: DEFAULT_SESSIONS,
  backOff: { ...DEFAULT_BACK_OFF },
  accessoryRotation: { ...DEFAULT_ACCESSORY_ROTATION },
};

/**
 * Rules stored before a field existed are read with that field's default, so old rows keep working.
 */
export function readTeamRules(stored: unknown): TeamRules {
  const merged = { ...DEFAULT_TEAM_RULES, ...(typeof stored === 'object' && stored ? stored : {}) };
  const parsed = storedTeamRulesSchema.safeParse(merged);
  if (parsed.success) return parsed.data;
  // Rules saved before sessions existed, with slots of their own: sessions built from those slots.
  const slots = (merged as { slots?: unknown }).slots;
  if (!('sessions' in (stored as object)) && Array.isArray(slots)) {
    const again = storedTeamRulesSchema.safeParse({ ...merged, sessions: defaultSessionsFor(slots) });
    if (again.success) return again.data;
  }
  return DEFAULT_TEAM_RULES;
}

/** What a coach may change for one athlete: the rotation windows and joint budgets. */
export const athleteRuleOverridesSchema = z
  .object({
    repeatWindowWeeks: z.number().int().min(1).max(26).optional(),
    familyWindowWeeks: z.number().int().min(1).max(26).optional(),
    jointWindowWeeks: z.number().int().min(1).max(12).optional(),
    jointBudget: jointBudgetSchema.optional(),
  })
  .strict();
export type AthleteRuleOverrides = z.infer<typeof athleteRuleOverridesSchema>;

/** Reads a stored overrides object, dropping anything that no longer validates. */
export function readRuleOverrides(stored: unknown): AthleteRuleOverrides {
  const parsed = athleteRuleOverridesSchema.safeParse(stored ?? {});
  return parsed.success ? parsed.data : {};
}

/** `PUT /api/rules`: the whole rules document and the gym's equipment, with the version that was read (0: none yet). */
export const teamRulesBody = z.object({
  rules: teamRulesSchema,
  equipment: equipmentListSchema,
  version: z.number().int().min(0),
});
export type TeamRulesBody = z.input<typeof teamRulesBody>;

export interface TeamRulesDoc {
  rules: TeamRules;
  equipment: string[];
  /** 0 while the team has never saved its rules (the defaults apply). */
  version: number;
  updatedAt: string | null;
  updatedBy: { id: number; name: string } | null;
}

// How the trade's values read on screen: one definition of each word, for the client and the server.
import type { Division, Sex } from './calc/classes';
import type { Lift } from './engine/types';
import type { AccessoryCategory, SessionPart } from './schemas/week';
import type { TissueKind, TissuePrescription } from './engine/tissue';
import type { Scheme } from './schemas/training';
import { mondayOf } from './engine/weeks';

/** The short lift names of the library, the board and the history lists. */
export const LIFT_LABEL: Record<Lift, string> = { squat: 'Squat', bench: 'Bench', deadlift: 'Deadlift' };
/** The full competition lift names of training days and meets. */
export const LIFT_NAME: Record<Lift, string> = { squat: 'Squat', bench: 'Bench press', deadlift: 'Deadlift' };

/** A variant's risk tier in one word, and as the library lists it ("2 · moderate"). */
export const RISK_WORD: Record<1 | 2 | 3, string> = { 1: 'low', 2: 'moderate', 3: 'high' };
export const RISK_LABEL: Record<1 | 2 | 3, string> = {
  1: `1 · ${RISK_WORD[1]}`,
  2: `2 · ${RISK_WORD[2]}`,
  3: `3 · ${RISK_WORD[3]}`,
};

/** A risk ceiling, as the board's library filter offers it. */
export const RISK_CEILING_LABEL: Record<1 | 2 | 3, string> = {
  1: `${RISK_WORD[1].charAt(0).toUpperCase()}${RISK_WORD[1].slice(1)} only`,
  2: `Up to ${RISK_WORD[2]}`,
  3: `Up to ${RISK_WORD[3]}`,
};

/** Joint stress 0–3 of a variant or an accessory. */
export const STRESS_LABEL = ['0 · none', '1 · light', '2 · moderate', '3 · heavy'] as const;

export const DIVISION_LABEL: Record<Division, string> = { open: 'Open', junior: 'Junior', subjunior: 'Sub-junior' };
export const SEX_LABEL: Record<Sex, string> = { M: 'Men', F: 'Women' };

/** The parts of a training session, as the rules and My week name them. */
export const SESSION_PART_LABELS: Readonly<Record<SessionPart, string>> = {
  maxEffort: 'Max effort',
  speed: 'Speed',
  supplemental: 'Supplemental',
  accessories: 'Accessories',
  tissue: 'Connective-tissue work',
};

export const WEEKDAY_LABELS = ['Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday', 'Sunday'] as const;

/** Accessory categories, as the library and My week list them. */
export const ACCESSORY_CATEGORY_LABELS: Readonly<Record<AccessoryCategory, string>> = {
  upperBack: 'Upper back',
  lats: 'Lats',
  triceps: 'Triceps',
  hamstrings: 'Hamstrings',
  abdominals: 'Abdominals',
  grip: 'Grip',
  glutes: 'Glutes',
  shoulders: 'Shoulders',
};

/** The kinds of connective-tissue work, inside a sentence and as a heading. */
export const TISSUE_KIND_WORD: Readonly<Record<TissueKind, string>> = {
  highRep: 'high-rep light work',
  isometric: 'isometric pulses',
  loadedStretch: 'loaded stretch',
};
export const TISSUE_KIND_LABEL: Readonly<Record<TissueKind, string>> = {
  highRep: 'High-rep light work',
  isometric: 'Isometric pulses',
  loadedStretch: 'Loaded stretch',
};

/** A connective-tissue item's dose in a few words, as My week and the athlete's page list it. */
export function tissueDoseLabel(item: TissuePrescription): string {
  switch (item.kind) {
    case 'highRep':
      return `${item.dose.reps} reps, ${item.dose.band} band${item.dose.easySets ? `, in ${item.dose.easySets} easy sets` : ''}`;
    case 'isometric':
      return `${item.dose.pulsesPerAngle} × ${item.dose.seconds} s at ${item.dose.angles.length} angles`;
    case 'loadedStretch':
      return `${item.dose.fatigueReps} light reps, then hold ${item.dose.holdSeconds} s`;
  }
}

/** How often a connective-tissue item is done in its week. */
export function tissueSessionsLabel(sessionsPerWeek: number): string {
  return sessionsPerWeek === 1 ? 'Once this week' : `${sessionsPerWeek} sessions this week`;
}

/** What a max-effort pick asks of the athlete, as My week (and its first glance) words it. */
export const SCHEME_GOAL_LABEL: Readonly<Record<Scheme, string>> = {
  single: 'Work up to a top single',
  triple: 'Work up to a top triple',
  five: 'Work up to a top set of five',
};

/** My week before its max-effort work can be shown. */
export const MY_WEEK_DRAFT_NOTICE =
  'Your coach is still planning this week. Your max-effort work shows here once it is published.';
export const MY_WEEK_EMPTY_NOTICE =
  'No max-effort work is planned for this week yet. Your coach fills it on the board.';

/** The caution on every page where training load is set or shown. */
export const TRAINING_CAUTION_TEXT =
  'Stop the set on sharp or unusual pain. For an injury, see a licensed clinician; Rackturn plans training and is ' +
  'not medical advice. Follow the rules of your federation and your gym.';

const spanDate = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', timeZone: 'UTC' });

/** An ISO week's days, Monday to Sunday ("30 Nov – 6 Dec"), the same in the browser and on the server. */
export function weekSpanLabel(week: string): string {
  const monday = mondayOf(week);
  return `${spanDate.format(monday)} – ${spanDate.format(new Date(monday.getTime() + 6 * 86_400_000))}`;
}

// The athlete's week page: this week's max-effort picks with their history, connective-tissue work,
// check-ins, bodyweight and the next meet. Weights are kilograms; the page shows them in `unit`.
import { z } from 'zod';
import type { BackOffRule, Division, OpeningRange, Sex } from '../calc';
import { isoWeek, type Unit } from './common';
import type { Scheme, TissueCheckinRow, TissueWorkWeek, TopSet, VariantRecord, Bodyweight } from './training';
import type { TissueKind } from '../engine/tissue';
import type { MyWeekSession } from './week';

export const myWeekQuery = z.object({ week: isoWeek.optional() });

export interface MyWeekPick {
  planEntryId: number;
  slotId: string;
  slotLabel: string;
  scheme: Scheme;
  /** Reps of the top set the scheme asks for: 1, 3 or 5. */
  schemeReps: number;
  variant: {
    id: number;
    name: string;
    lift: 'squat' | 'bench' | 'deadlift';
    family: string;
    bar: string;
    specificity: number;
    notes: string | null;
  };
  /** The latest top set on this variant before this week. */
  lastTime: TopSet | null;
  /** Records on this variant over every top set, this week's included. */
  record: VariantRecord;
  /** Top sets logged against this pick. */
  logged: TopSet[];
  /** Never done before: a suggested opening range from the competition lift's estimate (an estimate). */
  opening: OpeningRange | null;
}

export interface BodyweightChange {
  gainKg: number;
  fromDate: string;
  toDate: string;
}

export interface BodyweightState {
  latest: Bodyweight | null;
  recent: Bodyweight[];
  /** The class the latest reading falls in, for the athlete's sex and division. */
  weightClass: string | null;
  /** The class the athlete is entered in at the next meet, when the coach set one. */
  enteredClass: string | null;
  sex: Sex;
  division: Division;
  /** Change over the 7 days up to the latest reading. */
  change7d: BodyweightChange | null;
  /** The team's line for a gain in the last week before a meet, in kg. */
  thresholdKg: number;
  /** Set when the meet is at most 7 days away and the 7-day gain passes the line. */
  caution: (BodyweightChange & { meetName: string; meetDate: string }) | null;
}

export interface MyWeekCheckin {
  week: string;
  kind: TissueKind | null;
  done: TissueCheckinRow[];
}

export interface MyWeek {
  week: string;
  /** false while the coach is still planning the week: no picks are shown then. */
  published: boolean;
  today: string;
  unit: Unit;
  athlete: { id: number; name: string; sex: Sex; division: Division };
  picks: MyWeekPick[];
  /** The team's back-off sets after each max-effort top set; null with none set or on a rest or deload week. */
  backOff: BackOffRule | null;
  /** A deload week: no max-effort work, lighter speed and accessory work. */
  deload: boolean;
  /** The week's sessions in the order of the week (none while the week is a draft). */
  sessions: MyWeekSession[];
  tissue: TissueWorkWeek;
  /** This week and last week: what was there to report on, and what was reported. */
  checkins: MyWeekCheckin[];
  meet: { name: string; date: string; daysOut: number; weeksOut: number } | null;
  bodyweight: BodyweightState;
}

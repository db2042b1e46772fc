// The invented demo club and its people. Every name here is made up for the demo.
import type { Division, Sex } from '../../../shared/calc';

export const DEMO_PASSWORD = 'rackturn-demo';

export interface DemoAthlete {
  key: string;
  name: string;
  sex: Sex;
  birthYear: number;
  division: Division;
  /** The heaviest risk tier the planner may pick; absent: no ceiling. */
  maxRisk?: 1 | 2 | 3;
  email?: string;
  unit?: 'kg' | 'lb';
  /** Invented starting estimated maxes (kg) and bodyweight (kg) for the history. */
  maxes: { squat: number; bench: number; deadlift: number };
  bodyweight: number;
  /** Equipment the athlete cannot use (the rest of the gym's list applies). */
  lacks?: string[];
  restrictions?: DemoRestriction[];
  /** Rest or deload weeks, in weeks from the current one. */
  restInWeeks?: number[];
  meetInWeeks?: number;
}

/** A restriction, dated in weeks from the current one (the first from its Monday, the last to its Sunday). */
export interface DemoRestriction {
  joint?: 'elbow' | 'lowerBack' | 'shoulder' | 'knee';
  maxStress?: number;
  emphasis?: ('bottom' | 'midRange' | 'lockout')[];
  families?: string[];
  fromInWeeks: number;
  /** Absent: no end set. */
  toInWeeks?: number;
  note: string;
}

export const DEMO_TEAM = { name: 'Copperkettle Barbell Club', unit: 'kg' as const, currency: 'EUR' };

export const DEMO_COACHES = [
  { email: 'coach@rackturn.test', name: 'Rosalind Achterberg', role: 'head_coach' as const },
  { email: 'coach2@rackturn.test', name: 'Tobias Wren', role: 'coach' as const },
];

export const DEMO_ATHLETES: DemoAthlete[] = [
  {
    key: 'noor',
    name: 'Noor Halvorsen',
    sex: 'F',
    birthYear: 1998,
    division: 'open',
    email: 'athlete@rackturn.test',
    maxes: { squat: 132.5, bench: 72.5, deadlift: 160 },
    bodyweight: 61.8,
    meetInWeeks: 5,
  },
  {
    key: 'dario',
    name: 'Dario Menditto',
    sex: 'M',
    birthYear: 1991,
    division: 'open',
    email: 'dario@rackturn.test',
    maxes: { squat: 235, bench: 157.5, deadlift: 272.5 },
    bodyweight: 91.4,
    restrictions: [
      {
        joint: 'elbow',
        maxStress: 1,
        emphasis: ['lockout'],
        fromInWeeks: -3,
        note: 'Irritated left elbow since the last block; no heavy lockout work.',
      },
    ],
  },
  {
    key: 'keisha',
    name: 'Keisha Obuya',
    sex: 'F',
    birthYear: 1995,
    division: 'open',
    email: 'keisha@rackturn.test',
    unit: 'lb',
    maxes: { squat: 167.5, bench: 95, deadlift: 195 },
    bodyweight: 75.2,
    restrictions: [
      {
        joint: 'lowerBack',
        maxStress: 1,
        fromInWeeks: -3,
        note: 'Cranky lower back; keep spinal loading light until it settles.',
      },
    ],
  },
  {
    key: 'jonas',
    name: 'Jonas Eberle',
    sex: 'M',
    birthYear: 1997,
    division: 'open',
    maxes: { squat: 195, bench: 130, deadlift: 230 },
    bodyweight: 82.1,
    meetInWeeks: 9,
  },
  {
    key: 'finn',
    name: 'Finn Castellane',
    sex: 'M',
    birthYear: 2004,
    division: 'junior',
    maxRisk: 2,
    maxes: { squat: 140, bench: 95, deadlift: 170 },
    bodyweight: 77.6,
    lacks: ['cambered bar'],
  },
  {
    key: 'priya',
    name: 'Priya Ramaswell',
    sex: 'F',
    birthYear: 1993,
    division: 'open',
    maxes: { squat: 150, bench: 85, deadlift: 182.5 },
    bodyweight: 68.3,
  },
  {
    key: 'hana',
    name: 'Hana Petrakova',
    sex: 'F',
    birthYear: 2006,
    division: 'junior',
    maxes: { squat: 110, bench: 60, deadlift: 135 },
    bodyweight: 56.4,
    restrictions: [
      {
        emphasis: ['bottom'],
        families: ['good morning'],
        fromInWeeks: 2,
        toInWeeks: 5,
        note: 'Hamstring strain on the mend (invented): no bottom-position work or good mornings for four weeks.',
      },
    ],
  },
  {
    key: 'tomasz',
    name: 'Tomasz Wielgo',
    sex: 'M',
    birthYear: 1988,
    division: 'open',
    maxes: { squat: 300, bench: 200, deadlift: 325 },
    bodyweight: 118.7,
    restInWeeks: [2],
  },
  {
    key: 'lucia',
    name: 'Lucia Ferrante',
    sex: 'F',
    birthYear: 1999,
    division: 'open',
    maxes: { squat: 120, bench: 67.5, deadlift: 145 },
    bodyweight: 66.9,
  },
  {
    key: 'oskar',
    name: 'Oskar Lindqvist',
    sex: 'M',
    birthYear: 2000,
    division: 'open',
    maxes: { squat: 180, bench: 125, deadlift: 215 },
    bodyweight: 88.5,
    lacks: ['chains'],
  },
  {
    key: 'mei',
    name: 'Mei Tanabe',
    sex: 'F',
    birthYear: 2008,
    division: 'subjunior',
    maxRisk: 2,
    maxes: { squat: 85, bench: 47.5, deadlift: 105 },
    bodyweight: 52.2,
  },
  {
    key: 'ruben',
    name: 'Ruben Salgado',
    sex: 'M',
    birthYear: 1994,
    division: 'open',
    maxes: { squat: 250, bench: 165, deadlift: 280 },
    bodyweight: 104.3,
  },
];

export const DEMO_MEETS = [
  {
    name: 'Copperkettle Winter Classic',
    inWeeks: 5,
    location: 'Copperkettle club hall',
    federation: 'Regional federation (demo)',
  },
  {
    name: 'Larkspur Valley Open',
    inWeeks: 9,
    location: 'Larkspur Valley sports centre',
    federation: 'Regional federation (demo)',
  },
];

/** A meet the club went to a few weeks ago; its results are already in the entrants' histories. */
export const PAST_MEET = {
  name: 'Harrowgate Autumn Open',
  weeksAgo: 4,
  location: 'Harrowgate community gym',
  federation: 'Regional federation (demo)',
  athletes: ['dario', 'keisha'],
};

export const OTHER_TEAM = {
  name: 'Quillmoor Strength Co.',
  headCoach: { email: 'other@rackturn.test', name: 'Petra Vosk' },
  athletes: [
    { name: 'Ivo Marsh', sex: 'M' as const },
    { name: 'Lena Brandtner', sex: 'F' as const },
  ],
};

// The invented demo library: ordinary exercise names of the trade, tagged with our own values for
// family, equipment, emphasis, joint stress (0–3), risk (1–3) and specificity (0–1). Demo data only.
import type { StressMap } from '../schema';

export interface DemoVariant {
  name: string;
  lift: 'squat' | 'bench' | 'deadlift';
  family: string;
  bar: string;
  equipment: string[];
  emphasis: 'bottom' | 'midRange' | 'lockout';
  stress: StressMap;
  risk: 1 | 2 | 3;
  specificity: number;
  scheme: 'single' | 'triple' | 'five';
  notes?: string;
}

export const DEMO_EQUIPMENT = [
  'box',
  'bands',
  'chains',
  'rack pins',
  'boards',
  'blocks',
  'deficit platform',
  'safety squat bar',
  'cambered bar',
  'multi-grip bar',
  'trap bar',
];

type Row = [
  name: string,
  family: string,
  bar: string,
  equipment: string[],
  emphasis: DemoVariant['emphasis'],
  stress: StressMap,
  risk: 1 | 2 | 3,
  specificity: number,
  scheme: DemoVariant['scheme'],
  notes?: string,
];

const squat: Row[] = [
  ['Box squat, parallel box', 'box squat', 'straight', ['box'], 'bottom', { lowerBack: 2, hip: 2, knee: 1 }, 2, 0.6, 'single', 'Sit back to the box, pause without relaxing, drive up.'],
  ['Box squat, low box', 'box squat', 'straight', ['box'], 'bottom', { lowerBack: 2, hip: 3, knee: 1 }, 2, 0.5, 'single'],
  ['Box squat, high box', 'box squat', 'straight', ['box'], 'lockout', { lowerBack: 2, hip: 1, knee: 1 }, 1, 0.5, 'triple'],
  ['Box squat, parallel box, safety squat bar', 'box squat', 'safety squat', ['box', 'safety squat bar'], 'bottom', { lowerBack: 2, hip: 2, knee: 2 }, 2, 0.5, 'single'],
  ['Box squat, low box, safety squat bar', 'box squat', 'safety squat', ['box', 'safety squat bar'], 'bottom', { lowerBack: 2, hip: 3, knee: 2 }, 2, 0.45, 'single'],
  ['Box squat, parallel box, cambered bar', 'box squat', 'cambered', ['box', 'cambered bar'], 'bottom', { lowerBack: 3, hip: 2, knee: 1 }, 3, 0.45, 'single'],
  ['Box squat with bands', 'box squat', 'straight', ['box', 'bands'], 'lockout', { lowerBack: 2, hip: 2, knee: 1 }, 2, 0.55, 'single'],
  ['Box squat with chains', 'box squat', 'straight', ['box', 'chains'], 'lockout', { lowerBack: 2, hip: 2, knee: 1 }, 2, 0.55, 'single'],
  ['Pause squat, 3-second pause', 'pause squat', 'straight', [], 'bottom', { lowerBack: 2, hip: 2, knee: 2 }, 2, 0.9, 'triple', 'Stay tight in the hole; the pause is counted out loud.'],
  ['Pause squat, safety squat bar', 'pause squat', 'safety squat', ['safety squat bar'], 'bottom', { lowerBack: 2, hip: 2, knee: 2 }, 2, 0.7, 'triple'],
  ['Pin squat, below parallel', 'pin squat', 'straight', ['rack pins'], 'bottom', { lowerBack: 2, hip: 2, knee: 2 }, 2, 0.7, 'single'],
  ['Pin squat, parallel', 'pin squat', 'straight', ['rack pins'], 'midRange', { lowerBack: 2, hip: 2, knee: 1 }, 2, 0.7, 'single'],
  ['Squat from pins, dead stop', 'pin squat', 'straight', ['rack pins'], 'bottom', { lowerBack: 2, hip: 2, knee: 2 }, 2, 0.6, 'single'],
  ['Front squat', 'front squat', 'straight', [], 'midRange', { knee: 3, wrist: 1, elbow: 1, lowerBack: 1, hip: 1 }, 2, 0.5, 'triple'],
  ['Front squat, 2-second pause', 'front squat', 'straight', [], 'bottom', { knee: 3, wrist: 1, elbow: 1, lowerBack: 1, hip: 1 }, 2, 0.45, 'triple'],
  ['Safety squat bar squat', 'safety bar squat', 'safety squat', ['safety squat bar'], 'midRange', { knee: 2, lowerBack: 2, hip: 2 }, 1, 0.7, 'single'],
  ['Safety squat bar squat with bands', 'safety bar squat', 'safety squat', ['safety squat bar', 'bands'], 'lockout', { knee: 2, lowerBack: 2, hip: 2 }, 2, 0.65, 'single'],
  ['Cambered bar squat', 'cambered bar squat', 'cambered', ['cambered bar'], 'bottom', { lowerBack: 3, hip: 2, knee: 2 }, 3, 0.6, 'single'],
  ['Competition squat, top single', 'competition squat', 'straight', [], 'midRange', { lowerBack: 2, hip: 2, knee: 2, shoulder: 1 }, 2, 1, 'single', 'Meet depth, meet commands, competition gear as allowed.'],
  ['Competition squat with chains', 'competition squat', 'straight', ['chains'], 'lockout', { lowerBack: 2, hip: 2, knee: 2, shoulder: 1 }, 2, 0.85, 'single'],
];

const hinge: Row[] = [
  ['Good morning, straight bar', 'good morning', 'straight', [], 'midRange', { lowerBack: 3, hip: 2 }, 3, 0.3, 'five', 'Soft knees, push the hips back; stop the set when the back rounds.'],
  ['Good morning, safety squat bar', 'good morning', 'safety squat', ['safety squat bar'], 'midRange', { lowerBack: 2, hip: 2 }, 2, 0.3, 'five'],
  ['Good morning, cambered bar', 'good morning', 'cambered', ['cambered bar'], 'bottom', { lowerBack: 3, hip: 3 }, 3, 0.3, 'five'],
  ['Seated good morning', 'good morning', 'straight', ['box'], 'midRange', { lowerBack: 2, hip: 1 }, 2, 0.2, 'five'],
  ['Good morning with bands, safety squat bar', 'good morning', 'safety squat', ['safety squat bar', 'bands'], 'lockout', { lowerBack: 2, hip: 2 }, 2, 0.3, 'five'],
  ['Good morning from pins', 'good morning', 'straight', ['rack pins'], 'bottom', { lowerBack: 3, hip: 2 }, 3, 0.3, 'triple'],
  ['Rack pull, below knee', 'rack pull', 'straight', ['rack pins'], 'midRange', { lowerBack: 2, hip: 1 }, 2, 0.6, 'single'],
  ['Rack pull, at knee', 'rack pull', 'straight', ['rack pins'], 'lockout', { lowerBack: 2, hip: 1 }, 2, 0.5, 'single'],
  ['Rack pull, above knee', 'rack pull', 'straight', ['rack pins'], 'lockout', { lowerBack: 2, hip: 1 }, 1, 0.4, 'single'],
  ['Block pull, 5 cm', 'block pull', 'straight', ['blocks'], 'midRange', { lowerBack: 2, hip: 2 }, 2, 0.8, 'single'],
  ['Block pull, 10 cm', 'block pull', 'straight', ['blocks'], 'lockout', { lowerBack: 2, hip: 1 }, 2, 0.7, 'single'],
  ['Deficit deadlift, 5 cm', 'deficit pull', 'straight', ['deficit platform'], 'bottom', { lowerBack: 3, hip: 2, knee: 1 }, 3, 0.8, 'single'],
  ['Deficit deadlift, 2.5 cm', 'deficit pull', 'straight', ['deficit platform'], 'bottom', { lowerBack: 2, hip: 2, knee: 1 }, 2, 0.85, 'single'],
  ['Paused deadlift, below knee', 'paused pull', 'straight', [], 'midRange', { lowerBack: 3, hip: 2 }, 2, 0.85, 'triple'],
  ['Deadlift with bands', 'accommodated pull', 'straight', ['bands'], 'lockout', { lowerBack: 2, hip: 2 }, 2, 0.8, 'single'],
  ['Deadlift with chains', 'accommodated pull', 'straight', ['chains'], 'lockout', { lowerBack: 2, hip: 2 }, 2, 0.8, 'single'],
  ['Sumo deadlift', 'sumo pull', 'straight', [], 'bottom', { hip: 3, lowerBack: 1, knee: 1 }, 2, 0.6, 'single'],
  ['Sumo block pull', 'sumo pull', 'straight', ['blocks'], 'lockout', { hip: 2, lowerBack: 1 }, 1, 0.5, 'single'],
  ['Trap bar deadlift', 'trap bar pull', 'trap', ['trap bar'], 'midRange', { knee: 2, lowerBack: 1, hip: 1 }, 1, 0.5, 'single'],
  ['Trap bar deadlift from a deficit', 'trap bar pull', 'trap', ['trap bar', 'deficit platform'], 'bottom', { knee: 2, lowerBack: 2, hip: 2 }, 2, 0.45, 'triple'],
  ['Snatch-grip deadlift', 'snatch-grip pull', 'straight', [], 'bottom', { lowerBack: 3, hip: 2, shoulder: 1, wrist: 1 }, 3, 0.6, 'triple'],
  ['Stiff-leg deadlift', 'stiff-leg pull', 'straight', [], 'midRange', { lowerBack: 2, hip: 2 }, 2, 0.4, 'five'],
  ['Competition deadlift, top single', 'competition pull', 'straight', [], 'midRange', { lowerBack: 2, hip: 2, knee: 1 }, 2, 1, 'single', 'Meet stance and grip; a clean lockout and a controlled lowering.'],
];

const press: Row[] = [
  ['Floor press', 'floor press', 'straight', [], 'lockout', { elbow: 2, wrist: 1 }, 1, 0.4, 'single', 'Shoulder-friendly: the floor stops the range.'],
  ['Floor press, close grip', 'floor press', 'straight', [], 'lockout', { elbow: 3, wrist: 1 }, 2, 0.35, 'single'],
  ['Floor press with chains', 'floor press', 'straight', ['chains'], 'lockout', { elbow: 2, wrist: 1 }, 1, 0.4, 'single'],
  ['Floor press, multi-grip bar', 'floor press', 'multi-grip', ['multi-grip bar'], 'lockout', { elbow: 1 }, 1, 0.3, 'triple'],
  ['Pin press, just off the chest', 'pin press', 'straight', ['rack pins'], 'bottom', { shoulder: 2, elbow: 1, wrist: 1 }, 2, 0.7, 'single'],
  ['Pin press, mid-range', 'pin press', 'straight', ['rack pins'], 'midRange', { shoulder: 1, elbow: 2, wrist: 1 }, 1, 0.6, 'single'],
  ['Pin press, lockout', 'pin press', 'straight', ['rack pins'], 'lockout', { elbow: 3, wrist: 1 }, 2, 0.4, 'single'],
  ['Board press, 1 board', 'board press', 'straight', ['boards'], 'bottom', { shoulder: 1, elbow: 2, wrist: 1 }, 1, 0.8, 'single'],
  ['Board press, 2 boards', 'board press', 'straight', ['boards'], 'midRange', { shoulder: 1, elbow: 2, wrist: 1 }, 1, 0.7, 'single'],
  ['Board press, 3 boards', 'board press', 'straight', ['boards'], 'lockout', { elbow: 3, wrist: 2 }, 2, 0.5, 'single'],
  ['Board press, 5 boards', 'board press', 'straight', ['boards'], 'lockout', { elbow: 3, wrist: 2 }, 3, 0.35, 'single'],
  ['Close-grip bench press', 'close-grip press', 'straight', [], 'midRange', { elbow: 2, wrist: 2, shoulder: 1 }, 2, 0.7, 'triple'],
  ['Close-grip bench press with bands', 'close-grip press', 'straight', ['bands'], 'lockout', { elbow: 3, wrist: 2, shoulder: 1 }, 3, 0.6, 'single'],
  ['Close-grip press from pins, dead stop', 'close-grip press', 'straight', ['rack pins'], 'midRange', { elbow: 2, wrist: 2 }, 2, 0.5, 'single'],
  ['Multi-grip bar bench press', 'specialty-bar press', 'multi-grip', ['multi-grip bar'], 'midRange', { elbow: 1, shoulder: 1 }, 1, 0.6, 'triple'],
  ['Cambered bar bench press', 'specialty-bar press', 'cambered', ['cambered bar'], 'bottom', { shoulder: 3, elbow: 1 }, 3, 0.5, 'triple'],
  ['Bench press with bands', 'accommodated press', 'straight', ['bands'], 'lockout', { shoulder: 1, elbow: 3, wrist: 2 }, 3, 0.7, 'single'],
  ['Bench press with chains', 'accommodated press', 'straight', ['chains'], 'lockout', { shoulder: 1, elbow: 2, wrist: 2 }, 2, 0.75, 'single'],
  ['Reverse-band bench press', 'accommodated press', 'straight', ['bands'], 'midRange', { shoulder: 1, elbow: 2, wrist: 2 }, 2, 0.7, 'single'],
  ['Pause bench press, 3-second pause', 'pause press', 'straight', [], 'bottom', { shoulder: 2, elbow: 1, wrist: 1 }, 1, 0.95, 'triple'],
  ['Pause bench press, just above the chest', 'pause press', 'straight', [], 'bottom', { shoulder: 2, elbow: 1, wrist: 1 }, 2, 0.85, 'triple'],
  ['Feet-up bench press', 'feet-up press', 'straight', [], 'midRange', { shoulder: 2, elbow: 1, wrist: 1 }, 1, 0.75, 'triple'],
  ['Incline bench press', 'incline press', 'straight', [], 'midRange', { shoulder: 2, elbow: 1, wrist: 1 }, 1, 0.4, 'five'],
  ['Competition bench press, top single', 'competition press', 'straight', [], 'midRange', { shoulder: 2, elbow: 2, wrist: 1 }, 2, 1, 'single', 'Meet grip, a still pause on the chest, wait for the commands.'],
];

const toVariant =
  (lift: DemoVariant['lift']) =>
  ([name, family, bar, equipment, emphasis, stress, risk, specificity, scheme, notes]: Row): DemoVariant => ({
    name,
    lift,
    family,
    bar,
    equipment,
    emphasis,
    stress,
    risk,
    specificity,
    scheme,
    ...(notes ? { notes } : {}),
  });

// Good mornings and pulls fill the lower slot as hinge work, so they are tagged with the deadlift.
export const DEMO_LIBRARY: DemoVariant[] = [
  ...squat.map(toVariant('squat')),
  ...hinge.map(toVariant('deadlift')),
  ...press.map(toVariant('bench')),
];

/** The second demo team's small library: same trade names, its own rows. */
export const OTHER_TEAM_LIBRARY: DemoVariant[] = DEMO_LIBRARY.filter((v) =>
  ['Box squat, parallel box', 'Pause squat, 3-second pause', 'Rack pull, below knee', 'Block pull, 5 cm', 'Floor press', 'Board press, 2 boards', 'Close-grip bench press', 'Competition bench press, top single'].includes(v.name),
);

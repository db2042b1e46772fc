// A small board snapshot for the board's client logic: two athletes (one with an elbow restriction and
// a longer repeat window of their own), a library of squat and bench variants, and a few picks.
import { addWeeks, weekRange } from '../../../shared/engine/weeks';
import { DEFAULT_TEAM_RULES, type BoardData, type BoardVariant, type PlanEntryDto } from '../../../shared/schemas';

export const CURRENT = '2027-W10';
export const wk = (n: number) => addWeeks(CURRENT, n);

const variant = (
  id: number,
  name: string,
  lift: BoardVariant['lift'],
  family: string,
  stress: BoardVariant['stress'],
  extra: Partial<BoardVariant> = {},
): BoardVariant => ({
  id,
  name,
  lift,
  family,
  bar: 'straight',
  equipment: [],
  emphasis: 'midRange',
  stress,
  risk: 1,
  specificity: 0.8,
  scheme: 'single',
  meetPhaseWeeks: null,
  archived: false,
  ...extra,
});

export const VARIANTS: BoardVariant[] = [
  variant(1, 'Box squat', 'squat', 'box squat', { knee: 1, hip: 1 }),
  variant(2, 'Pin squat', 'squat', 'pin squat', { knee: 1 }),
  variant(3, 'Front squat', 'squat', 'front squat', { knee: 2 }),
  variant(4, 'Floor press', 'bench', 'floor press', { shoulder: 1 }),
  variant(5, 'Board press', 'bench', 'board press', { elbow: 3 }),
  variant(6, 'Old squat', 'squat', 'old', { knee: 1 }, { archived: true }),
];

let nextId = 100;
export function entry(
  athleteId: number,
  week: string,
  slotId: string,
  variantId: number | null,
  extra: Partial<PlanEntryDto> = {},
): PlanEntryDto {
  return {
    id: nextId++,
    athleteId,
    week,
    slotId,
    variantId,
    source: 'engine',
    pinned: false,
    reason: null,
    reasons: [],
    version: 1,
    updatedBy: null,
    updatedByName: null,
    updatedAt: '2027-03-01T10:00:00.000Z',
    ...extra,
  };
}

export function snapshot(entries: PlanEntryDto[] = [], context: BoardData['context'] = []): BoardData {
  const from = wk(-2);
  const to = wk(3);
  return {
    currentWeek: CURRENT,
    from,
    to,
    weeks: weekRange(from, to),
    rules: DEFAULT_TEAM_RULES,
    seed: 'client-test',
    rulesVersion: 1,
    slots: DEFAULT_TEAM_RULES.slots.map((s) => ({ ...s })),
    variants: VARIANTS,
    athletes: [
      {
        id: 1,
        name: 'Ada',
        equipment: [],
        restrictions: [
          {
            joint: 'elbow',
            maxStress: 1,
            emphasis: [],
            families: [],
            fromDate: '2027-01-04',
            toDate: null,
            note: null,
          },
        ],
        meet: null,
        ruleOverrides: { repeatWindowWeeks: 8 },
        maxRisk: null,
        restWeeks: [],
      },
      {
        id: 2,
        name: 'Bo',
        equipment: [],
        restrictions: [],
        meet: null,
        ruleOverrides: {},
        maxRisk: null,
        restWeeks: [],
      },
    ],
    entries,
    context,
  };
}

// Accessory rotation: blocks of a few weeks, the repeat window, restrictions, one use per week, and the joint
// budgets shared with the max-effort work. The three-week block and six-week window are common practice for
// this kind of training (no published source); the properties below are the engine's own contract.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  accessoryBlockOf,
  accessoryBlockWeek,
  rotateAccessories,
  type AccessoryChoice,
  type AccessoryRotationRequest,
} from '../../../shared/engine/accessories';
import { JOINTS, type Joint, type Restriction } from '../../../shared/engine/types';
import { addWeeks, weekFromNumber, weekNumber } from '../../../shared/engine/weeks';

const CATEGORIES = ['upperBack', 'triceps', 'hamstrings', 'abdominals'];
const rules = { blockWeeks: 3, repeatWindowWeeks: 6, jointWindowWeeks: 4, jointBudget: {} };

const acc = (id: string, category: string, stress: Partial<Record<Joint, number>> = {}): AccessoryChoice => ({
  id,
  name: `Exercise ${id}`,
  category,
  stress,
});

/** The first week of a block, so a request starts where a block does. */
const blockStart = (n: number, blockWeeks: number) => weekFromNumber(n * blockWeeks);

describe('blocks', () => {
  it('number the weeks of a block 1, 2, 3 and never shift, across a year end', () => {
    const start = '2026-W50';
    const seq = Array.from({ length: 9 }, (_, i) => accessoryBlockWeek(addWeeks(start, i), 3));
    seq.forEach((w, i) => i > 0 && expect(w).toBe((seq[i - 1]! % 3) + 1));
    expect(accessoryBlockOf(addWeeks(start, 3), 3)).toBe(accessoryBlockOf(start, 3) + 1);
  });
});

describe('rotateAccessories, worked examples', () => {
  const library = [
    acc('row', 'upperBack', { shoulder: 1 }),
    acc('seal', 'upperBack'),
    acc('face', 'upperBack', { shoulder: 1 }),
    acc('ghr', 'hamstrings', { knee: 1 }),
    acc('rdl', 'hamstrings', { lowerBack: 2 }),
  ];
  const start = blockStart(700, 3);
  const weeks = [0, 1, 2, 3, 4, 5].map((n) => addWeeks(start, n));
  const slots = [{ sessionId: 'upper', categories: ['upperBack'] }];

  it('keeps a pick for the whole block and changes it in the next, lightest first', () => {
    const out = rotateAccessories({ weeks, slots, library, history: [], rules });
    const ids = out.picks.map((p) => p.accessoryId);
    // Never used: the lightest (no stress) comes first, then the lighter of the rest by name.
    expect(ids).toEqual(['seal', 'seal', 'seal', 'face', 'face', 'face']);
    expect(out.unfilled).toEqual([]);
  });

  it('a team’s own windows change the rotation: a longer block keeps a pick longer, a longer window keeps it away', () => {
    // The same six weeks with two-week blocks: three picks instead of two.
    const twoWeeks = { ...rules, blockWeeks: 2, repeatWindowWeeks: 2 };
    const from = blockStart(1050, 2);
    const six = [0, 1, 2, 3, 4, 5].map((n) => addWeeks(from, n));
    const short = rotateAccessories({ weeks: six, slots, library, history: [], rules: twoWeeks });
    expect(short.picks.map((p) => p.accessoryId)).toEqual(['seal', 'seal', 'face', 'face', 'row', 'row']);
    // With a window of two weeks, the first pick may come back in the fourth block; with six it may not
    // until the window has passed, so the least recent one that is free comes back only when all were used.
    const eight = [0, 1, 2, 3, 4, 5, 6, 7].map((n) => addWeeks(from, n));
    const back = rotateAccessories({ weeks: eight, slots, library, history: [], rules: twoWeeks });
    expect(back.picks.slice(6).map((p) => p.accessoryId)).toEqual(['seal', 'seal']);
    expect(back.picks.some((p) => p.early)).toBe(false);
    const wide = rotateAccessories({
      weeks: eight,
      slots,
      library,
      history: [],
      rules: { ...twoWeeks, repeatWindowWeeks: 6 },
    });
    expect(wide.picks.slice(6).map((p) => p.accessoryId)).toEqual(['seal', 'seal']);
    expect(wide.picks.slice(6).every((p) => p.early)).toBe(true);
  });

  it('continues the block the history started, and leaves out what was used in the window', () => {
    const history = [
      { week: addWeeks(start, -3), sessionId: 'upper', category: 'upperBack', accessoryId: 'seal' },
      { week: start, sessionId: 'upper', category: 'upperBack', accessoryId: 'row' },
    ];
    const out = rotateAccessories({ weeks: weeks.slice(1), slots, library, history, rules });
    expect(out.picks.map((p) => p.accessoryId)).toEqual(['row', 'row', 'face', 'face', 'face']);
  });

  it('says why a category stays empty', () => {
    const base = { weeks: [start], library, history: [], rules };
    expect(rotateAccessories({ ...base, slots: [{ sessionId: 'x', categories: ['grip'] }] }).unfilled[0]!.reason).toBe(
      'empty',
    );
    const restrictions: Restriction[] = [
      { joint: 'knee', maxStress: 0 },
      { joint: 'lowerBack', maxStress: 1 },
    ];
    const hams = [{ sessionId: 'lower', categories: ['hamstrings'] }];
    expect(rotateAccessories({ ...base, slots: hams, restrictions }).unfilled[0]!.reason).toBe('restriction');
    // Knee budget 4 over four weeks, already 4 from the max-effort work: the glute-ham raise does not fit,
    // the Romanian deadlift (lower back) does.
    const baseLoad = { [start]: { knee: 4 } };
    const budget = { ...rules, jointBudget: { knee: 4, lowerBack: 2 } };
    expect(rotateAccessories({ ...base, slots: hams, baseLoad, rules: budget }).picks[0]!.accessoryId).toBe('rdl');
    const tight = { ...rules, jointBudget: { knee: 4, lowerBack: 1 } };
    expect(rotateAccessories({ ...base, slots: hams, baseLoad, rules: tight }).unfilled[0]!.reason).toBe('budget');
    // Every hamstring accessory used last week: the least recent comes back early rather than none.
    const used = ['ghr', 'rdl'].map((accessoryId, i) => ({
      week: addWeeks(start, -1 - i),
      sessionId: 'other',
      category: 'hamstrings',
      accessoryId,
    }));
    expect(rotateAccessories({ ...base, slots: hams, history: used }).picks).toEqual([
      { week: start, sessionId: 'lower', category: 'hamstrings', accessoryId: 'rdl', early: true },
    ]);
    const two = [
      { sessionId: 'a', categories: ['hamstrings'] },
      { sessionId: 'b', categories: ['hamstrings'] },
      { sessionId: 'c', categories: ['hamstrings'] },
    ];
    expect(rotateAccessories({ ...base, slots: two }).unfilled.map((u) => u.reason)).toEqual(['taken']);
  });

  it('never picks an archived accessory', () => {
    const out = rotateAccessories({
      weeks: [start],
      slots,
      library: library.map((a) => ({ ...a, archived: a.id !== 'face' })),
      history: [],
      rules,
    });
    expect(out.picks.map((p) => p.accessoryId)).toEqual(['face']);
  });
});

const stressArb = fc.record(
  Object.fromEntries(JOINTS.map((j) => [j, fc.integer({ min: 0, max: 3 })])) as Record<Joint, fc.Arbitrary<number>>,
  { requiredKeys: [] },
);

const requestArb: fc.Arbitrary<AccessoryRotationRequest> = fc
  .record({
    blockWeeks: fc.integer({ min: 1, max: 4 }),
    repeatWindowWeeks: fc.integer({ min: 0, max: 8 }),
    jointWindowWeeks: fc.integer({ min: 1, max: 5 }),
    block: fc.integer({ min: 300, max: 900 }),
    span: fc.integer({ min: 1, max: 8 }),
    library: fc.array(
      fc.record({
        category: fc.constantFrom(...CATEGORIES),
        stress: stressArb,
        archived: fc.boolean(),
      }),
      { maxLength: 14 },
    ),
    slots: fc.array(fc.subarray(CATEGORIES, { minLength: 1 }), { minLength: 1, maxLength: 4 }),
    budget: fc.record(
      Object.fromEntries(JOINTS.map((j) => [j, fc.integer({ min: 0, max: 14 })])) as Record<
        Joint,
        fc.Arbitrary<number>
      >,
      { requiredKeys: [] },
    ),
    base: fc.array(fc.tuple(fc.integer({ min: -8, max: 10 }), stressArb), { maxLength: 10 }),
    past: fc.array(fc.tuple(fc.integer({ min: 1, max: 12 }), fc.nat(), fc.nat()), { maxLength: 10 }),
    restrictions: fc.array(
      fc.record({ joint: fc.constantFrom(...JOINTS), maxStress: fc.integer({ min: 0, max: 3 }) }),
      {
        maxLength: 2,
      },
    ),
  })
  .map((r) => {
    const start = blockStart(r.block, r.blockWeeks);
    const library = r.library.map((a, i) => ({ ...a, id: `a${i}`, name: `Exercise ${i}` }));
    const slots = r.slots.map((categories, i) => ({ sessionId: `s${i}`, categories }));
    const baseLoad: Record<string, Partial<Record<Joint, number>>> = {};
    for (const [offset, stress] of r.base) baseLoad[addWeeks(start, offset)] = stress;
    const history = library.length
      ? r.past.map(([back, s, a]) => {
          const slot = slots[s % slots.length]!;
          const accessory = library[a % library.length]!;
          return {
            week: addWeeks(start, -back),
            sessionId: slot.sessionId,
            category: accessory.category,
            accessoryId: accessory.id,
          };
        })
      : [];
    return {
      weeks: Array.from({ length: r.span }, (_, i) => addWeeks(start, i)),
      slots,
      library,
      history,
      baseLoad,
      restrictions: r.restrictions,
      rules: {
        blockWeeks: r.blockWeeks,
        repeatWindowWeeks: r.repeatWindowWeeks,
        jointWindowWeeks: r.jointWindowWeeks,
        jointBudget: r.budget,
      },
    };
  });

describe('rotateAccessories, properties', () => {
  const runs = { numRuns: 300 };

  it('fills or explains every category of every session in every week, with an unarchived one of that category', () => {
    fc.assert(
      fc.property(requestArb, (req) => {
        const out = rotateAccessories(req);
        const byId = new Map(req.library.map((a) => [a.id, a]));
        for (const week of req.weeks)
          for (const slot of req.slots)
            for (const category of slot.categories) {
              const hit = (x: { week: string; sessionId: string; category: string }) =>
                x.week === week && x.sessionId === slot.sessionId && x.category === category;
              expect(out.picks.filter(hit).length + out.unfilled.filter(hit).length).toBe(1);
            }
        for (const p of out.picks) {
          const a = byId.get(p.accessoryId)!;
          expect(a.category).toBe(p.category);
          expect(a.archived).toBe(false);
        }
      }),
      runs,
    );
  });

  it('keeps one pick per session and category through a block, and never one accessory twice in a week', () => {
    fc.assert(
      fc.property(requestArb, (req) => {
        const out = rotateAccessories(req);
        const held = new Map<string, string>();
        for (const p of out.picks) {
          const key = `${accessoryBlockOf(p.week, req.rules.blockWeeks)}|${p.sessionId}|${p.category}`;
          expect(held.get(key) ?? p.accessoryId).toBe(p.accessoryId);
          held.set(key, p.accessoryId);
        }
        for (const week of req.weeks) {
          const ids = out.picks.filter((p) => p.week === week).map((p) => p.accessoryId);
          expect(new Set(ids).size).toBe(ids.length);
        }
      }),
      runs,
    );
  });

  it('brings an accessory back within the repeat window only when every one of its category was used there', () => {
    fc.assert(
      fc.property(requestArb, (req) => {
        const out = rotateAccessories(req);
        const all = [...req.history, ...out.picks];
        const usedInWindow = (id: string, week: string) => {
          const start = accessoryBlockOf(week, req.rules.blockWeeks) * req.rules.blockWeeks;
          return all.some(
            (u) =>
              u.accessoryId === id &&
              weekNumber(u.week) < start &&
              weekNumber(u.week) >= start - req.rules.repeatWindowWeeks,
          );
        };
        for (const p of out.picks) {
          if (!p.early) {
            expect(usedInWindow(p.accessoryId, p.week)).toBe(false);
            continue;
          }
          // Every other one of the category was used in the window, or could not be had for another reason:
          // a restriction, another session's pick that week, or stress on a budgeted joint.
          const budgeted = JOINTS.filter((j) => req.rules.jointBudget[j] !== undefined);
          const others = req.library.filter((a) => a.category === p.category && !a.archived);
          for (const a of others) {
            const elsewhere = out.picks.some((q) => q.week === p.week && q.accessoryId === a.id && q !== p);
            const restricted = (req.restrictions ?? []).some((r) => (a.stress[r.joint!] ?? 0) > r.maxStress!);
            const loaded = budgeted.some((j) => (a.stress[j] ?? 0) > 0);
            expect(usedInWindow(a.id, p.week) || elsewhere || restricted || loaded).toBe(true);
          }
        }
      }),
      runs,
    );
  });

  it('respects joint restrictions and never takes a joint over budget with an accessory', () => {
    fc.assert(
      fc.property(requestArb, (req) => {
        const out = rotateAccessories(req);
        const byId = new Map(req.library.map((a) => [a.id, a]));
        for (const p of out.picks)
          for (const r of req.restrictions ?? [])
            expect(byId.get(p.accessoryId)!.stress[r.joint!] ?? 0).toBeLessThanOrEqual(r.maxStress!);
        const { jointWindowWeeks: span, jointBudget } = req.rules;
        const load = (j: Joint, n: number, withPicks: boolean) => {
          const week = weekFromNumber(n);
          const uses = [...req.history, ...(withPicks ? out.picks : [])].filter((u) => u.week === week);
          return (
            (req.baseLoad?.[week]?.[j] ?? 0) + uses.reduce((s, u) => s + (byId.get(u.accessoryId)?.stress[j] ?? 0), 0)
          );
        };
        const nums = req.weeks.map(weekNumber);
        for (const j of JOINTS) {
          const b = jointBudget[j];
          if (b === undefined) continue;
          for (let end = Math.min(...nums); end <= Math.max(...nums) + span - 1; end++) {
            let before = 0;
            let after = 0;
            for (let n = end - span + 1; n <= end; n++) {
              before += load(j, n, false);
              after += load(j, n, true);
            }
            if (after > before) expect(after).toBeLessThanOrEqual(b);
          }
        }
      }),
      runs,
    );
  });

  it('answers the same request the same way', () => {
    fc.assert(
      fc.property(requestArb, (req) => {
        expect(rotateAccessories(req)).toEqual(rotateAccessories(structuredClone(req)));
      }),
      { numRuns: 100 },
    );
  });
});

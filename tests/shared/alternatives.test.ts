// "What fits here": the ranking is the engine's own rating of each variant for the cell, grouped clean →
// warning → break, and leaves out what the slot can never hold. Property checks with fast-check.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  addWeeks,
  generatePlan,
  prepareCandidateChecks,
  rankAlternatives,
  summariseAlternatives,
  type PlanRequest,
  type Variant,
} from '../../shared/engine';

const WEEK = '2027-W10';
const lifts = ['squat', 'bench', 'deadlift'] as const;

const variantArb = (i: number) =>
  fc
    .record({
      lift: fc.constantFrom(...lifts),
      family: fc.constantFrom('a', 'b', 'c', 'd'),
      risk: fc.constantFrom(1 as const, 2 as const, 3 as const),
      specificity: fc.double({ min: 0, max: 1, noNaN: true }),
      elbow: fc.integer({ min: 0, max: 3 }),
    })
    .map((v): Variant => ({
      id: `v${i}`,
      name: `Variant ${i}`,
      lift: v.lift,
      family: v.family,
      risk: v.risk,
      specificity: v.specificity,
      stress: { elbow: v.elbow },
      equipment: [],
    }));

const requestArb = fc
  .integer({ min: 1, max: 12 })
  .chain((n) => fc.tuple(...Array.from({ length: n }, (_, i) => variantArb(i))))
  .chain((variants) =>
    fc
      .array(fc.record({ back: fc.integer({ min: 1, max: 6 }), v: fc.integer({ min: 0, max: variants.length - 1 }) }), {
        maxLength: 6,
      })
      .map((uses): PlanRequest => {
        const history = [...new Map(uses.map((u) => [u.back, u])).values()].map((u) => ({
          athleteId: 'a',
          week: addWeeks(WEEK, -u.back),
          slotId: 'upper',
          variantId: variants[u.v]!.id,
        }));
        return {
          variants,
          slots: [{ id: 'upper', lifts: ['bench'] }],
          athletes: [{ id: 'a', equipment: [], restrictions: [{ joint: 'elbow', maxStress: 2 }], history }],
          rules: {
            repeatWindowWeeks: 4,
            familyWindowWeeks: 2,
            jointWindowWeeks: 3,
            jointBudget: { elbow: 5 },
            taper: [],
            seed: 's',
          },
          weeks: [WEEK],
          planned: [],
        };
      }),
  );

describe('rankAlternatives', () => {
  it('lists every variant the slot takes, with the engine’s own rating, clean → warning → break', () => {
    fc.assert(
      fc.property(requestArb, (req) => {
        const items = rankAlternatives(req, 'a', WEEK, 'upper');
        const bench = req.variants.filter((v) => v.lift === 'bench').map((v) => v.id);
        expect(items.map((i) => i.variantId).sort()).toEqual([...bench].sort());
        const order = { clean: 0, warning: 1, break: 2 };
        const ranks = items.map((i) => order[i.status]);
        expect(ranks).toEqual([...ranks].sort((x, y) => x - y));
        const checks = prepareCandidateChecks(req);
        for (const i of items) {
          expect(i.status).toBe(checks.rate('a', WEEK, 'upper', i.variantId).status);
          expect(i.reasons.length).toBeGreaterThan(0);
          expect(i.status === 'break').toBe(i.violations.length > 0);
        }
      }),
      { numRuns: 150 },
    );
  });

  it('orders each status group by the planner’s own score, so the engine’s pick leads the variants it may use', () => {
    fc.assert(
      fc.property(requestArb, (req) => {
        const items = rankAlternatives(req, 'a', WEEK, 'upper');
        const checks = prepareCandidateChecks(req);
        const scored = items.map((i) => ({ status: i.status, score: checks.score('a', WEEK, 'upper', i.variantId) }));
        for (let k = 1; k < scored.length; k++) {
          if (scored[k]!.status === scored[k - 1]!.status) {
            expect(scored[k]!.score).toBeGreaterThanOrEqual(scored[k - 1]!.score);
          }
        }
        // The planner adds only its seeded tie-break (at most 2.5 points, see shared/engine/goals.ts) to
        // this score, so its pick for the empty cell is within that of the best usable variant.
        const usable = scored.filter((x) => x.status !== 'break');
        const pick = generatePlan(req).entries.find((e) => e.slotId === 'upper');
        if (!pick || usable.length === 0) return;
        const best = Math.min(...usable.map((x) => x.score));
        expect(checks.score('a', WEEK, 'upper', pick.variantId)).toBeLessThanOrEqual(best + 2.5 + 1e-9);
      }),
      { numRuns: 150 },
    );
  });

  it('says which rules block when nothing is clean', () => {
    fc.assert(
      fc.property(requestArb, (req) => {
        const items = rankAlternatives(req, 'a', WEEK, 'upper');
        const s = summariseAlternatives(items);
        expect(s.clean + s.warning + s.break).toBe(items.length);
        if (s.clean > 0) expect(s.blockedBy).toEqual([]);
        else
          for (const b of s.blockedBy)
            expect(items.filter((i) => i.violations.some((v) => v.rule === b.rule)).length).toBe(b.count);
      }),
      { numRuns: 150 },
    );
  });

  it('prefers, within a group, the family used longest ago', () => {
    const v = (id: string, family: string): Variant => ({
      id,
      name: id,
      lift: 'bench',
      family,
      risk: 1,
      specificity: 0.5,
      stress: {},
      equipment: [],
    });
    const req: PlanRequest = {
      variants: [v('recent', 'x'), v('older', 'y'), v('never', 'z')],
      slots: [{ id: 'upper', lifts: ['bench'] }],
      athletes: [
        {
          id: 'a',
          equipment: [],
          restrictions: [],
          history: [
            { athleteId: 'a', week: addWeeks(WEEK, -9), slotId: 'upper', variantId: 'recent' },
            { athleteId: 'a', week: addWeeks(WEEK, -12), slotId: 'upper', variantId: 'older' },
          ],
        },
      ],
      rules: { repeatWindowWeeks: 2, familyWindowWeeks: 1, jointWindowWeeks: 2, jointBudget: {}, taper: [], seed: 's' },
      weeks: [WEEK],
    };
    expect(rankAlternatives(req, 'a', WEEK, 'upper').map((i) => i.variantId)).toEqual(['never', 'older', 'recent']);
  });
});

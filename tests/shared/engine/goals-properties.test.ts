// The version-2 soft goals against the exhaustive planner on small cases with version-2 inputs: comfort
// first (every joint at or under the comfort ratio whenever some rule-clean plan can), then lift
// balance (whenever some rule-clean plan, comfortable if any can be, is in balance).
import { describe, expect, it } from 'vitest';
import { checkPlan, generatePlan, peakLoadRatio, type PlanEntry } from '../../../shared/engine/index';
import { exhaustive, isBalanced } from './exhaustive';
import { smallCase } from './fixtures';

const strip = (entries: (PlanEntry & { reasons: string[] })[]): PlanEntry[] =>
  entries.map(({ reasons: _r, ...e }) => e);

describe('soft goals on small cases, against every possible plan', () => {
  it('keeps every joint under the comfort line, and the lift balance, whenever some plan can', () => {
    let comfortCases = 0;
    let balanceCases = 0;
    let feasibleCases = 0;
    for (let seed = 1; seed <= 500; seed++) {
      const req = smallCase(seed, { version2: true });
      const ex = exhaustive(req, 2_000_000, true);
      const res = generatePlan(req);
      expect(checkPlan(req, strip(res.entries))).toEqual([]);
      if (!ex.feasible) continue;
      feasibleCases++;
      expect(res.unfilled).toEqual([]);
      const comfort = req.rules.comfortRatio ?? 0.8;
      const peak = peakLoadRatio(req, req.athletes[0]!.id, strip(res.entries));
      if (ex.comfortable) {
        comfortCases++;
        expect(peak, `seed ${seed}`).toBeLessThanOrEqual(comfort + 1e-9);
      }
      if (ex.balanced && req.rules.liftBalanceWeeks) {
        balanceCases++;
        expect(isBalanced(req, strip(res.entries)), `seed ${seed}`).toBe(true);
      }
    }
    // The cases must exercise both goals.
    expect(feasibleCases).toBeGreaterThan(150);
    expect(comfortCases).toBeGreaterThan(100);
    expect(balanceCases).toBeGreaterThan(50);
  }, 300_000);
});

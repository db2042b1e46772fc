// The planner against an exhaustive search on small cases: it must find a complete plan whenever one
// exists, keep every joint under the comfort line whenever some plan can, and above that line come
// close to the best possible peak joint load ratio (under it, a lighter plan is not preferred).
import fc from 'fast-check';
import { describe, expect, it, vi } from 'vitest';
import { checkPlan, generatePlan, peakLoadRatio } from '../../../shared/engine/index';
import { exhaustive, mostFilled } from './exhaustive';
import { smallCase } from './fixtures';

// Hundreds of exhaustive searches per test: allow for a busy machine (speed lives in the benchmarks).
vi.setConfig({ testTimeout: 120_000 });

describe('planning ahead on small cases', () => {
  it('leaves nothing unfilled whenever some complete rule-clean plan exists', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 2 ** 31 - 1 }), (seed) => {
        const req = smallCase(seed);
        const ex = exhaustive(req);
        const res = generatePlan(req);
        expect(checkPlan(req, res.entries)).toEqual([]);
        if (ex.feasible) expect(res.unfilled).toEqual([]);
        else expect(res.unfilled.length).toBeGreaterThan(0);
      }),
      { numRuns: 400 },
    );
  });

  it('stays under the comfort line when the optimum does, else within 10% of the optimum in 95% of cases', () => {
    const gaps: number[] = [];
    const comfort = 0.8; // the default comfort ratio
    for (let seed = 5000; seed < 7000 && gaps.length < 300; seed++) {
      const req = smallCase(seed);
      const ex = exhaustive(req);
      if (!ex.feasible) continue;
      const res = generatePlan(req);
      const peak = peakLoadRatio(req, req.athletes[0]!.id, res.entries);
      expect(peak).toBeGreaterThanOrEqual(ex.bestPeak - 1e-9); // the optimum really is a lower bound
      if (ex.bestPeak <= comfort) expect(peak).toBeLessThanOrEqual(comfort + 1e-9);
      else gaps.push((peak - ex.bestPeak) / ex.bestPeak);
    }
    expect(gaps.length).toBeGreaterThanOrEqual(50);
    const within = gaps.filter((g) => g <= 0.1 + 1e-9).length / gaps.length;
    expect(within).toBeGreaterThanOrEqual(0.95);
  });

  it('fills as many cells as any rule-clean plan can in at least 95% of over-constrained cases', () => {
    let cases = 0;
    let best = 0;
    for (let seed = 20_000; cases < 200; seed++) {
      const req = smallCase(seed);
      if (exhaustive(req).feasible) continue;
      cases++;
      const most = mostFilled(req);
      const filled = generatePlan(req).entries.length;
      expect(filled).toBeLessThanOrEqual(most);
      if (filled === most) best++;
    }
    expect(best / cases).toBeGreaterThanOrEqual(0.95);
  });
});

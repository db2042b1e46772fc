// Properties of the engine over random libraries, slots, rules, histories, boards and meets (with and
// without the version-2 inputs), checked against a deliberately naive rule checker written here from
// the rules' plain definitions.
import fc from 'fast-check';
import { describe, expect, it, vi } from 'vitest';
import {
  JOINTS,
  RULE_IDS,
  addWeeks,
  checkPlan,
  explainCandidate,
  generatePlan,
  weeksBetween,
  type PlanEntry,
  type PlanRequest,
  type RuleId,
  type Variant,
} from '../../../shared/engine/index';
import { restricts } from './exhaustive';
import { randomRequest as randomOf, type RequestOptions } from './fixtures';

/**
 * Every (entry, rule) pair broken on the board history ∪ entries, straight from the definitions:
 * pairs of entries closer than a window, and sums over every span of J weeks holding the entry.
 */
function naiveBreaks(req: PlanRequest, entries: PlanEntry[]): Set<string> {
  const out = new Set<string>();
  const r = req.rules;
  for (const e of entries) {
    const a = req.athletes.find((x) => x.id === e.athleteId);
    if (!a) continue;
    const key = (rule: RuleId) => out.add(`${e.athleteId}|${e.week}|${e.slotId}|${e.variantId}|${rule}`);
    const v = req.variants.find((x) => x.id === e.variantId);
    if (!v) {
      key('unknownVariant');
      continue;
    }
    const slot = req.slots.find((s) => s.id === e.slotId);
    if (v.archived) key('archived');
    if (a.restWeeks?.includes(e.week)) key('restWeek');
    if (!slot || !slot.lifts.includes(v.lift)) key('liftMismatch');
    if (v.equipment.some((x) => !a.equipment.includes(x))) key('equipment');
    if (restricts(a, v, e.week)) key('restriction');
    if (a.maxRisk !== undefined && v.risk > a.maxRisk) key('riskCeiling');
    if (v.meetPhaseWeeks !== undefined) {
      const d = a.meetWeek ? weeksBetween(e.week, a.meetWeek) : -1;
      if (d < 0 || d > v.meetPhaseWeeks) key('meetPhase');
    }
    if (a.meetWeek) {
      const d = weeksBetween(e.week, a.meetWeek);
      for (const t of r.taper) {
        if (d < 0 || d > t.weeksOut) continue;
        if (v.risk > t.maxRisk) key('taperRisk');
        if (t.minSpecificity !== undefined && v.specificity < t.minSpecificity) key('taperSpecificity');
      }
    }
    const board = [...a.history, ...entries.filter((x) => x.athleteId === a.id)];
    const others = board.filter((x) => x !== e);
    const variantOf = (x: PlanEntry): Variant | undefined => req.variants.find((y) => y.id === x.variantId);
    for (const o of others) {
      const d = Math.abs(weeksBetween(o.week, e.week));
      if (o.variantId === e.variantId && d < Math.max(1, r.repeatWindowWeeks)) key('repeat');
      if (variantOf(o)?.family === v.family && d < r.familyWindowWeeks) key('family');
    }
    const J = Math.max(1, r.jointWindowWeeks);
    for (const j of JOINTS) {
      const budget = r.jointBudget[j];
      if (budget === undefined || !(v.stress[j] ?? 0)) continue;
      for (let back = 0; back < J; back++) {
        const start = addWeeks(e.week, -back);
        let total = 0;
        for (const o of board) {
          const at = weeksBetween(start, o.week);
          if (at >= 0 && at < J) total += variantOf(o)?.stress[j] ?? 0;
        }
        if (total > budget + 1e-9) key('jointBudget');
      }
    }
  }
  return out;
}

const keysOf = (req: PlanRequest, entries: PlanEntry[]) =>
  new Set(checkPlan(req, entries).map((v) => `${v.athleteId}|${v.week}|${v.slotId}|${v.variantId}|${v.rule}`));
const cellKey = (e: { athleteId: string; week: string; slotId: string }) => `${e.athleteId}|${e.week}|${e.slotId}`;
const strip = (entries: (PlanEntry & { reasons?: string[] })[]): PlanEntry[] =>
  entries.map(({ reasons: _r, ...e }) => e);

// Each property runs a few hundred plans: allow for a busy machine (speed lives in the benchmarks).
vi.setConfig({ testTimeout: 60_000 });

const seeds = fc.integer({ min: 0, max: 2 ** 31 - 1 });
const RUNS = { numRuns: 150 };

describe.each([
  ['version-1 requests', false],
  ['requests with version-2 inputs', true],
])('engine properties, %s', (_name, version2) => {
  const randomRequest = (seed: number, opts: RequestOptions = {}) => randomOf(seed, { version2, ...opts });
  it('checkPlan finds exactly the breaks the naive checker finds, on random boards', () => {
    fc.assert(
      fc.property(seeds, (seed) => {
        const req = randomRequest(seed, { planned: 0.8, pinned: 0.5 });
        expect(keysOf(req, req.planned!)).toEqual(naiveBreaks(req, req.planned!));
      }),
      RUNS,
    );
  });

  it('engine picks never break a hard rule, and every cell appears exactly once', () => {
    fc.assert(
      fc.property(seeds, (seed) => {
        const req = randomRequest(seed);
        const res = generatePlan(req);
        const pinned = new Set(res.entries.filter((e) => e.pinned).map(cellKey));
        const broken = (keys: Set<string>) => [...keys].filter((k) => !pinned.has(k.split('|').slice(0, 3).join('|')));
        expect(broken(keysOf(req, res.entries))).toEqual([]);
        expect(broken(naiveBreaks(req, res.entries))).toEqual([]);
        const seen = [...res.entries, ...res.unfilled].map(cellKey).sort();
        // Rest-week cells are neither filled nor unfilled, unless a pinned entry holds them.
        const cells = req.athletes
          .flatMap((a) =>
            req.weeks.flatMap((w) =>
              req.slots.map((s) => `${a.id}|${w}|${s.id}`).filter((k) => !a.restWeeks?.includes(w) || pinned.has(k)),
            ),
          )
          .sort();
        expect(seen).toEqual(cells);
        for (const c of res.cleared) {
          expect(req.athletes.find((a) => a.id === c.athleteId)?.restWeeks).toContain(c.week);
          expect(req.planned?.some((e) => cellKey(e) === cellKey(c) && !e.pinned && e.variantId === c.variantId)).toBe(
            true,
          );
        }
      }),
      RUNS,
    );
  });

  it('keeps pinned entries, keeps valid unpinned entries, and names a broken rule for every swap', () => {
    fc.assert(
      fc.property(seeds, (seed) => {
        const req = randomRequest(seed, { planned: 0.7, pinned: 0.3 });
        const planned = req.planned!;
        const res = generatePlan(req);
        const byCell = new Map(res.entries.map((e) => [cellKey(e), e]));
        const perCell = new Map<string, number>();
        for (const e of planned) perCell.set(cellKey(e), (perCell.get(cellKey(e)) ?? 0) + 1);
        const inPlan = (e: PlanEntry) => req.weeks.includes(e.week) && req.slots.some((s) => s.id === e.slotId);
        const planBreaks = checkPlan(req, planned);
        for (const e of planned.filter((x) => inPlan(x) && perCell.get(cellKey(x)) === 1)) {
          const got = byCell.get(cellKey(e));
          if (e.pinned) expect(got).toMatchObject({ variantId: e.variantId, pinned: true });
          const valid = !planBreaks.some((v) => cellKey(v) === cellKey(e) && v.variantId === e.variantId);
          if (!e.pinned && valid) expect(got?.variantId).toBe(e.variantId);
        }
        for (const s of res.swaps) {
          expect(RULE_IDS).toContain(s.rule);
          expect(byCell.get(cellKey(s))?.variantId).toBe(s.to);
          expect(s.to).not.toBe(s.from);
          const from = planned.find((e) => cellKey(e) === cellKey(s) && !e.pinned && e.variantId === s.from);
          expect(from).toBeDefined();
          expect(planBreaks.some((v) => cellKey(v) === cellKey(s) && v.variantId === s.from && v.rule === s.rule)).toBe(
            true,
          );
        }
      }),
      RUNS,
    );
  });

  it('leaves a cell unfilled only when every variant breaks a rule there, and says which', () => {
    fc.assert(
      fc.property(seeds, (seed) => {
        const req = randomRequest(seed, { planned: 0.3 });
        const res = generatePlan(req);
        if (res.unfilled.length === 0) return;
        const after: PlanRequest = { ...req, planned: strip(res.entries) };
        for (const u of res.unfilled) {
          const slot = req.slots.find((s) => s.id === u.slotId)!;
          const fitting = req.variants.filter((v) => slot.lifts.includes(v.lift));
          const rules = new Set<RuleId>();
          for (const v of req.variants) {
            const found = explainCandidate(after, u.athleteId, u.week, u.slotId, v.id);
            expect(found.length).toBeGreaterThan(0);
            if (fitting.includes(v)) found.forEach((f) => rules.add(f.rule));
          }
          expect(u.blockedBy).toEqual(fitting.length ? RULE_IDS.filter((r) => rules.has(r)) : ['liftMismatch']);
        }
      }),
      RUNS,
    );
  });

  it('is deterministic, and each athlete depends only on their own input', () => {
    fc.assert(
      fc.property(seeds, fc.integer({ min: 0, max: 2 }), (seed, drop) => {
        const req = randomRequest(seed, { athletes: 3 });
        const res = generatePlan(req);
        expect(generatePlan(structuredClone(req))).toEqual(res);
        const dropped = req.athletes[drop]!.id;
        const fewer = { ...req, athletes: req.athletes.filter((a) => a.id !== dropped).reverse() };
        const keep = (r: typeof res) =>
          r.entries.filter((e) => e.athleteId !== dropped).sort((x, y) => cellKey(x).localeCompare(cellKey(y)));
        expect(keep(generatePlan(fewer))).toEqual(keep(res));
      }),
      { numRuns: 80 },
    );
  });

  it('checkPlan reports a planted break of each rule', () => {
    fc.assert(
      fc.property(seeds, fc.constantFrom(...RULE_IDS), (seed, rule) => {
        const req = randomRequest(seed, { weeks: 4, planned: 0, athletes: 1 });
        const res = generatePlan(req);
        const board = strip(res.entries);
        const a = req.athletes[0]!;
        const week = req.weeks[1]!;
        const slot = req.slots[0]!;
        const plant: Variant = {
          id: 'planted',
          name: 'Planted variant',
          lift: slot.lifts[0]!,
          family: 'planted-family',
          risk: 1,
          specificity: 1,
          stress: {},
          equipment: [],
        };
        let r: PlanRequest = { ...req, variants: [...req.variants, plant], planned: [] };
        let variantId = 'planted';
        let slotId = slot.id;
        switch (rule) {
          case 'unknownVariant':
            variantId = 'no-such-id';
            break;
          case 'liftMismatch': {
            // A lift the slot does not take, or (for a slot that takes every lift) a slot that does not exist.
            const other = (['squat', 'bench', 'deadlift'] as const).find((l) => !slot.lifts.includes(l));
            if (other) plant.lift = other;
            else slotId = 'no-such-slot';
            break;
          }
          case 'equipment':
            plant.equipment = ['planted gear'];
            break;
          case 'restriction':
            plant.stress = { knee: 2 };
            r = { ...r, athletes: [{ ...a, restrictions: [{ joint: 'knee', maxStress: 1 }] }] };
            break;
          case 'taperRisk':
          case 'taperSpecificity':
            plant.risk = 3;
            plant.specificity = 0.1;
            r = {
              ...r,
              athletes: [{ ...a, meetWeek: week }],
              rules: { ...r.rules, taper: [{ weeksOut: 0, maxRisk: 2, minSpecificity: 0.5 }] },
            };
            break;
          case 'repeat':
          case 'family':
            board.push({
              athleteId: a.id,
              week: req.weeks[2]!,
              slotId: slot.id,
              variantId: rule === 'repeat' ? 'planted' : 'planted-twin',
            });
            r.variants.push({ ...plant, id: 'planted-twin' });
            r = { ...r, rules: { ...r.rules, repeatWindowWeeks: 2, familyWindowWeeks: 2 } };
            break;
          case 'jointBudget':
            plant.stress = { wrist: 3 };
            r = { ...r, rules: { ...r.rules, jointBudget: { ...r.rules.jointBudget, wrist: 2 } } };
            break;
          case 'archived':
            plant.archived = true;
            break;
          case 'riskCeiling':
            plant.risk = 3;
            r = { ...r, athletes: [{ ...a, maxRisk: 2 }] };
            break;
          case 'meetPhase':
            plant.meetPhaseWeeks = 2;
            r = { ...r, athletes: [{ ...a, meetWeek: addWeeks(week, 5) }] };
            break;
          case 'restWeek':
            r = { ...r, athletes: [{ ...a, restWeeks: [week] }] };
            break;
        }
        const at = board.findIndex((e) => e.week === week && e.slotId === slot.id);
        const planted = { athleteId: a.id, week, slotId, variantId };
        if (at >= 0) board[at] = planted;
        else board.push(planted);
        const found = checkPlan(r, board).filter((v) => cellKey(v) === cellKey(planted));
        expect(found.map((v) => v.rule)).toContain(rule);
      }),
      RUNS,
    );
  });

  it('explainCandidate agrees with checkPlan on the board with that cell replaced', () => {
    fc.assert(
      fc.property(seeds, fc.nat(), fc.nat(), fc.boolean(), (seed, pickCell, pickVariant, unknown) => {
        const req = randomRequest(seed, { planned: 0.7, pinned: 0.3 });
        const a = req.athletes[pickCell % req.athletes.length]!;
        const week = req.weeks[pickCell % req.weeks.length]!;
        const slot = req.slots[pickCell % req.slots.length]!;
        const variantId = unknown ? 'not-in-library' : req.variants[pickVariant % req.variants.length]!.id;
        const cell = { athleteId: a.id, week, slotId: slot.id };
        const candidate = { ...cell, variantId };
        const board = [...req.planned!.filter((e) => cellKey(e) !== cellKey(cell)), candidate];
        const expected = checkPlan(req, board).filter((v) => cellKey(v) === cellKey(cell));
        expect(explainCandidate(req, a.id, week, slot.id, variantId)).toEqual(expected);
      }),
      { numRuns: 300 },
    );
  });

  it('gives different but still valid plans for different seeds when there is slack', () => {
    let differs = 0;
    for (let s = 0; s < 20; s++) {
      const req = randomRequest(1000 + s, {
        variants: 40,
        weeks: 4,
        athletes: 1,
        planned: 0,
        historyWeeks: 0,
        restrictions: false,
      });
      const loose = { ...req, rules: { ...req.rules, jointBudget: {}, taper: [] } };
      const one = generatePlan({ ...loose, rules: { ...loose.rules, seed: 'first' } });
      const two = generatePlan({ ...loose, rules: { ...loose.rules, seed: 'second' } });
      expect(checkPlan(loose, one.entries)).toEqual([]);
      expect(checkPlan(loose, two.entries)).toEqual([]);
      if (JSON.stringify(strip(one.entries)) !== JSON.stringify(strip(two.entries))) differs++;
    }
    expect(differs).toBeGreaterThanOrEqual(16);
  });
});

// Accessory rotation: which accessory of the team's library fills each category of each session, kept for a
// block of a few weeks and then changed, with its own repeat window, the athlete's joint restrictions, and
// its joint stress counted toward the same joint budgets as the max-effort work. Pure and deterministic.
import { JOINTS, type Joint, type Restriction } from './types';
import { weekNumber, type IsoWeek } from './weeks';

export interface AccessoryChoice {
  id: string;
  name: string;
  category: string;
  /** 0..3 per joint; absent = 0. */
  stress: Partial<Record<Joint, number>>;
  archived?: boolean;
}

export interface AccessoryRotationRules {
  /** The same accessories for this many weeks, then the next ones (blocks counted from a fixed origin). */
  blockWeeks: number;
  /** An accessory used in any of this many weeks before a block does not come back in that block. */
  repeatWindowWeeks: number;
  /** The max-effort rules' joint budgets: summed stress in any span of jointWindowWeeks <= budget. */
  jointWindowWeeks: number;
  jointBudget: Partial<Record<Joint, number>>;
}

/**
 * Rotate every three weeks and keep an accessory away for the next six (common practice for this kind of
 * training: accessories change every few weeks; no published source).
 */
export const DEFAULT_ACCESSORY_ROTATION = { blockWeeks: 3, repeatWindowWeeks: 6 } as const;

export interface AccessorySlot {
  sessionId: string;
  categories: string[];
}

export interface AccessoryUse {
  week: IsoWeek;
  sessionId: string;
  category: string;
  accessoryId: string;
}

export interface AccessoryRotationRequest {
  /** The weeks to fill. */
  weeks: IsoWeek[];
  slots: AccessorySlot[];
  library: AccessoryChoice[];
  /** Accessories already done or planned before these weeks. */
  history: AccessoryUse[];
  /** Joint stress already planned per week (the max-effort picks, other work); counted toward the budgets. */
  baseLoad?: Partial<Record<IsoWeek, Partial<Record<Joint, number>>>>;
  restrictions?: Restriction[];
  rules: AccessoryRotationRules;
}

export type UnfilledReason = 'empty' | 'restriction' | 'window' | 'taken' | 'budget';

export interface AccessoryRotation {
  /** `early`: every accessory of the category was used within the repeat window; the least recent came back. */
  picks: (AccessoryUse & { early?: true })[];
  unfilled: { week: IsoWeek; sessionId: string; category: string; reason: UnfilledReason }[];
}

export const UNFILLED_WORDS: Readonly<Record<UnfilledReason, (category: string) => string>> = {
  empty: (c) => `The library has no ${c} accessory in use`,
  restriction: (c) => `Every ${c} accessory stresses a restricted joint`,
  window: (c) => `Every ${c} accessory was used in the last weeks; add one to the library or pick by hand`,
  taken: (c) => `Every ${c} accessory is already in another session this week`,
  budget: (c) => `Every ${c} accessory would take a joint over its budget`,
};

/** Tolerance for summed stresses that are not whole numbers. */
const EPS = 1e-9;

/** Which rotation block a week is in, counted from a fixed origin so blocks never shift. */
export function accessoryBlockOf(week: IsoWeek, blockWeeks: number): number {
  return Math.floor(weekNumber(week) / blockWeeks);
}

/** Which week of its block a week is (1-based). */
export function accessoryBlockWeek(week: IsoWeek, blockWeeks: number): number {
  return weekNumber(week) - accessoryBlockOf(week, blockWeeks) * blockWeeks + 1;
}

const restrictionCovers = (r: Restriction, week: IsoWeek) =>
  (!r.fromWeek || r.fromWeek <= week) && (!r.toWeek || week <= r.toWeek);

/** Whether an accessory stays within every joint restriction covering any of the weeks. */
export function withinRestrictions(a: AccessoryChoice, restrictions: readonly Restriction[], weeks: IsoWeek[]) {
  return restrictions.every(
    (r) =>
      r.joint === undefined ||
      r.maxStress === undefined ||
      !weeks.some((w) => restrictionCovers(r, w)) ||
      (a.stress[r.joint] ?? 0) <= r.maxStress,
  );
}

/** Summed stress per week number and joint, with the spans over it. */
class Loads {
  private readonly byWeek = new Map<number, Float64Array>();
  constructor(private readonly span: number) {}

  add(week: number, stress: Partial<Record<Joint, number>>, times = 1) {
    let row = this.byWeek.get(week);
    if (!row) this.byWeek.set(week, (row = new Float64Array(JOINTS.length)));
    JOINTS.forEach((j, k) => (row[k]! += (stress[j] ?? 0) * times));
  }

  /** Summed stress on joint k in the span of `span` weeks ending at `end`. */
  spanLoad(k: number, end: number): number {
    let s = 0;
    for (let w = end - this.span + 1; w <= end; w++) s += this.byWeek.get(w)?.[k] ?? 0;
    return s;
  }

  /** Whether adding `stress` in each of `weeks` keeps every span touching them within the budgets. */
  fits(stress: Partial<Record<Joint, number>>, weeks: number[], budget: Partial<Record<Joint, number>>) {
    return JOINTS.every((j, k) => {
      const s = stress[j] ?? 0;
      const b = budget[j];
      if (s <= 0 || b === undefined) return true;
      const first = Math.min(...weeks);
      const last = Math.max(...weeks) + this.span - 1;
      for (let end = first; end <= last; end++) {
        const inSpan = weeks.filter((w) => w > end - this.span && w <= end).length;
        if (inSpan > 0 && this.spanLoad(k, end) + s * inSpan > Math.max(0, b) + EPS) return false;
      }
      return true;
    });
  }
}

/**
 * Fills each category of each session for the given weeks. One pick per session and category holds for a
 * whole block (continuing the pick the history holds for the same block); a new block takes the least
 * recently used accessory that is not archived, was not used in the repeat window, is not already in
 * another session of the week, keeps within the restrictions and fits the joint budgets in every week of the
 * block. When the window alone leaves a category empty (a small library), the least recently used one that
 * meets the rest comes back early and is marked so. What cannot be filled is reported with the reason.
 */
export function rotateAccessories(req: AccessoryRotationRequest): AccessoryRotation {
  const { blockWeeks, repeatWindowWeeks, jointWindowWeeks, jointBudget } = req.rules;
  const restrictions = req.restrictions ?? [];
  const byId = new Map(req.library.map((a) => [a.id, a]));
  const loads = new Loads(Math.max(1, jointWindowWeeks));
  for (const [week, stress] of Object.entries(req.baseLoad ?? {})) if (stress) loads.add(weekNumber(week), stress);
  const weeks = [...new Set(req.weeks)].sort();
  const inRequest = new Set(weeks);
  const uses: AccessoryUse[] = req.history.filter((h) => !inRequest.has(h.week));
  for (const h of uses) {
    const a = byId.get(h.accessoryId);
    if (a) loads.add(weekNumber(h.week), a.stress);
  }
  const lastUse = (id: string, before: number) =>
    Math.max(
      -Infinity,
      ...uses.filter((u) => u.accessoryId === id && weekNumber(u.week) < before).map((u) => weekNumber(u.week)),
    );

  const picks: AccessoryRotation['picks'] = [];
  const unfilled: AccessoryRotation['unfilled'] = [];
  const blocks = new Map<number, IsoWeek[]>();
  for (const w of weeks) {
    const b = accessoryBlockOf(w, blockWeeks);
    blocks.set(b, [...(blocks.get(b) ?? []), w]);
  }
  for (const [block, blockWeeksIn] of [...blocks].sort((a, b) => a[0] - b[0])) {
    const nums = blockWeeksIn.map(weekNumber);
    const blockStart = block * blockWeeks;
    const taken = new Set<string>();
    for (const slot of req.slots) {
      for (const category of slot.categories) {
        const ok = (a: AccessoryChoice) => !taken.has(a.id) && loads.fits(a.stress, nums, jointBudget);
        // The block's pick in the history continues when it still may.
        const earlier = uses
          .filter(
            (u) =>
              u.sessionId === slot.sessionId &&
              u.category === category &&
              accessoryBlockOf(u.week, blockWeeks) === block,
          )
          .sort((a, b) => b.week.localeCompare(a.week))[0];
        const kept = earlier ? byId.get(earlier.accessoryId) : undefined;
        let choice: AccessoryChoice | undefined;
        let reason: UnfilledReason = 'empty';
        let early = false;
        if (kept && !kept.archived && withinRestrictions(kept, restrictions, blockWeeksIn) && ok(kept)) choice = kept;
        else {
          const candidates = req.library.filter((a) => a.category === category && !a.archived);
          const steps: [UnfilledReason, (a: AccessoryChoice) => boolean][] = [
            ['restriction', (a) => withinRestrictions(a, restrictions, blockWeeksIn)],
            ['window', (a) => lastUse(a.id, blockStart) < blockStart - repeatWindowWeeks],
            ['taken', (a) => !taken.has(a.id)],
            ['budget', (a) => loads.fits(a.stress, nums, jointBudget)],
          ];
          const run = (only: typeof steps) => {
            let pool = candidates;
            let why: UnfilledReason = 'empty';
            for (const [step, keep] of only) {
              if (pool.length === 0) break;
              why = step;
              pool = pool.filter(keep);
            }
            return { pool, why };
          };
          const first = run(steps);
          let pool = first.pool;
          const why = first.why;
          reason = why;
          // A library too small for the window: the least recently used one comes back early, said so.
          if (pool.length === 0 && why !== 'restriction' && why !== 'empty') {
            const again = run(steps.filter(([step]) => step !== 'window'));
            if (again.pool.length > 0) {
              pool = again.pool;
              early = true;
            }
          }
          choice = pool
            .map((a) => ({
              a,
              last: lastUse(a.id, blockStart),
              total: JOINTS.reduce((sum, j) => sum + (a.stress[j] ?? 0), 0),
            }))
            .sort(
              (x, y) =>
                x.last - y.last ||
                x.total - y.total ||
                x.a.name.localeCompare(y.a.name) ||
                x.a.id.localeCompare(y.a.id),
            )[0]?.a;
        }
        for (const week of blockWeeksIn) {
          if (!choice) {
            unfilled.push({ week, sessionId: slot.sessionId, category, reason });
            continue;
          }
          const use = { week, sessionId: slot.sessionId, category, accessoryId: choice.id };
          picks.push(early ? { ...use, early: true as const } : use);
          uses.push(use);
        }
        if (choice) {
          taken.add(choice.id);
          for (const n of nums) loads.add(n, choice.stress);
        }
      }
    }
  }
  return { picks, unfilled };
}

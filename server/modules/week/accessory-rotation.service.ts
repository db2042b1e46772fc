// The accessories of an athlete's week chosen from the team's library: the rotation's suggestion (the team's
// block and repeat window, restrictions, and joint budgets counting the max-effort picks) and the checks on saving
// accessory work that names a library accessory.
import {
  UNFILLED_WORDS,
  accessoryBlockWeek,
  rotateAccessories,
  type AccessoryUse,
} from '../../../shared/engine/accessories';
import type { Joint } from '../../../shared/engine/types';
import { addWeeks } from '../../../shared/engine/weeks';
import { engineRestriction, engineRules } from '../../../shared/planning';
import {
  ACCESSORY_CATEGORY_LABELS,
  type AccessoryCategory,
  type AccessorySuggestion,
  type LibraryAccessory,
  type Session,
  type SessionWork,
  type TeamRules,
} from '../../../shared/schemas';
import type { AppContext } from '../../context';
import type { Queryable } from '../../db/client';
import { ValidationError } from '../../lib/errors';
import { engineAccessory, libraryOf } from '../accessories/accessories.service';
import { athleteHistory, getAthlete } from '../athletes/athletes.service';
import { readRulesOfTeam } from '../tissue/tissue.service';
import { getVariant } from '../variants/variants.service';
import * as repo from './week.repository';

type Lift = 'squat' | 'bench' | 'deadlift';

/** Categories for a session with no accessories yet: lower-body or upper-body work (common practice). */
function defaultCategories(session: Session, rules: TeamRules): AccessoryCategory[] {
  const lifts = new Set<Lift>(rules.slots.find((s) => s.id === session.slotId)?.lifts ?? []);
  if (session.speedLift) lifts.add(session.speedLift);
  const lower = lifts.has('squat') || lifts.has('deadlift');
  const upper = lifts.has('bench');
  if (lower && !upper) return ['hamstrings', 'abdominals'];
  if (upper && !lower) return ['upperBack', 'triceps'];
  return ['upperBack', 'abdominals'];
}

const categoriesOf = (work: SessionWork | undefined) => [...new Set((work?.accessories ?? []).map((a) => a.category))];

/** What the rotation suggests for each session of one athlete's week; nothing is saved. */
export async function suggestAccessories(
  ctx: AppContext,
  teamId: number,
  athleteId: number,
  week: string,
): Promise<AccessorySuggestion> {
  const db = ctx.database.db;
  const athlete = await getAthlete(ctx, teamId, athleteId);
  const [rules, library] = await Promise.all([readRulesOfTeam(db, teamId), libraryOf(db, teamId)]);
  // The team's windows (the defaults for a team that never set them).
  const { blockWeeks, repeatWindowWeeks } = rules.accessoryRotation;
  const { jointWindowWeeks, jointBudget } = engineRules(rules, '', athlete.ruleOverrides);
  const from = addWeeks(week, -(repeatWindowWeeks + blockWeeks + jointWindowWeeks));
  const to = addWeeks(week, jointWindowWeeks);
  const [rows, history] = await Promise.all([
    repo.athleteWeeksBetween(db, teamId, athleteId, from, to),
    athleteHistory(ctx, teamId, athleteId, { from, to }),
  ]);

  // The max-effort picks' joint stress counts toward the same budgets.
  const picks = history.picks.flatMap((p) => (p.variantId === null ? [] : [{ week: p.week, variantId: p.variantId }]));
  const variantIds = [...new Set(picks.map((p) => p.variantId))];
  const stressOf = new Map(
    (await Promise.all(variantIds.map((id) => getVariant(ctx, teamId, id)))).map((v) => [v.id, v.stress]),
  );
  const baseLoad: Record<string, Partial<Record<Joint, number>>> = {};
  for (const p of picks) {
    const row = (baseLoad[p.week] ??= {});
    for (const [j, s] of Object.entries(stressOf.get(p.variantId) ?? {}) as [Joint, number][])
      row[j] = (row[j] ?? 0) + s;
  }

  const uses: AccessoryUse[] = rows.flatMap((r) =>
    Object.entries(r.work).flatMap(([sessionId, w]) =>
      w.accessories.flatMap((a) =>
        a.accessoryId ? [{ week: r.week, sessionId, category: a.category, accessoryId: String(a.accessoryId) }] : [],
      ),
    ),
  );
  const own = rows.find((r) => r.week === week)?.work ?? {};
  const before = [...rows].filter((r) => r.week < week).sort((a, b) => b.week.localeCompare(a.week));
  const slots = rules.sessions
    .filter((s) => s.parts.includes('accessories'))
    .map((s) => {
      const known = [own, ...before.map((r) => r.work)].map((w) => categoriesOf(w[s.id])).find((c) => c.length > 0);
      return { sessionId: s.id, categories: known ?? defaultCategories(s, rules) };
    });

  const out = rotateAccessories({
    weeks: [week],
    slots,
    library: library.map(engineAccessory),
    history: uses,
    baseLoad,
    restrictions: athlete.restrictions.map((r) => engineRestriction(r)),
    rules: { blockWeeks, repeatWindowWeeks, jointWindowWeeks, jointBudget },
  });
  const byId = new Map(library.map((a) => [String(a.id), a]));
  const sessions: AccessorySuggestion['sessions'] = {};
  for (const slot of slots) {
    sessions[slot.sessionId] = {
      accessories: out.picks
        .filter((p) => p.sessionId === slot.sessionId)
        .map((p) => {
          const a = byId.get(p.accessoryId)!;
          return {
            accessoryId: a.id,
            name: a.name,
            category: a.category,
            sets: a.sets,
            reps: a.reps,
            loadKg: a.loadKg,
            rpe: a.rpe,
            early: p.early === true,
          };
        }),
      unfilled: out.unfilled
        .filter((u) => u.sessionId === slot.sessionId)
        .map((u) => ({
          category: u.category,
          reason: UNFILLED_WORDS[u.reason](
            ACCESSORY_CATEGORY_LABELS[u.category as AccessoryCategory]?.toLowerCase() ?? u.category,
          ),
        })),
    };
  }
  return { week, blockWeek: accessoryBlockWeek(week, blockWeeks), sessions };
}

/**
 * Accessory work that names a library accessory takes its name and category from the library; an id from
 * another team or none is refused by field, and an archived one only stays where the week already had it.
 */
export async function withLibraryAccessories(
  db: Queryable,
  teamId: number,
  work: Record<string, SessionWork>,
  stored: Record<string, SessionWork>,
): Promise<Record<string, SessionWork>> {
  const named = Object.values(work).some((w) => w.accessories.some((a) => a.accessoryId));
  if (!named) return work;
  const library = new Map<number, LibraryAccessory>((await libraryOf(db, teamId)).map((a) => [a.id, a]));
  const fields: Record<string, string[]> = {};
  const out: Record<string, SessionWork> = {};
  for (const [id, w] of Object.entries(work)) {
    const had = new Set((stored[id]?.accessories ?? []).map((a) => a.accessoryId));
    out[id] = {
      ...w,
      accessories: w.accessories.map((a, i) => {
        if (!a.accessoryId) return a;
        const lib = library.get(a.accessoryId);
        const key = `sessions.${id}.accessories.${i}.accessoryId`;
        if (!lib) fields[key] = ['Not in the accessory library'];
        else if (lib.archived && !had.has(a.accessoryId)) fields[key] = ['Archived in the library: pick another'];
        return lib ? { ...a, name: lib.name, category: lib.category } : a;
      }),
    };
  }
  if (Object.keys(fields).length > 0) throw new ValidationError('Some fields need attention.', fields);
  return out;
}

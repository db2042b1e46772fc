// The roster's rules: an athlete links to at most one athlete account of the same team, equipment
// defaults to the gym's, athletes are archived (their history stays), and restrictions are versioned.
import { weekOfDate } from '../../../shared/engine/weeks';
import { dayWeek, engineRestriction } from '../../../shared/planning';
import type { Restriction as EngineRestriction } from '../../../shared/engine/types';
import {
  readRuleOverrides,
  restrictionProblems,
  type Athlete,
  type AthleteHistory,
  type LinkableAccount,
  type ListResponse,
  type Restriction,
  type RestWeek,
} from '../../../shared/schemas';
import type { z } from 'zod';
import type {
  athleteBody,
  athleteListQuery,
  athletePatchBody,
  restrictionBody,
  restrictionPatchBody,
} from '../../../shared/schemas/roster';
import type { Queryable } from '../../db/client';
import type { AppContext } from '../../context';
import type { AuthContext } from '../../middleware/auth';
import { ConflictError, NotFoundError, ValidationError } from '../../lib/errors';
import { isDuplicateKey } from '../../db/errors';
import * as repo from './athletes.repository';
import { isoDay } from '../../lib/days';

/** Today as the server's calendar sees it (UTC), for "in force" and "upcoming". */
export const todayIso = (now = new Date()) => isoDay(now);

export function toRestrictionDto(r: repo.RestrictionRow, today = todayIso()): Restriction {
  return {
    id: r.id,
    athleteId: r.athleteId,
    joint: r.joint,
    maxStress: r.maxStress,
    emphasis: r.emphasis,
    families: r.families,
    fromDate: r.fromDate,
    toDate: r.toDate,
    fromWeek: dayWeek(r.fromDate),
    toWeek: r.toDate === null ? null : dayWeek(r.toDate),
    note: r.note,
    active: r.fromDate <= today && (r.toDate === null || r.toDate >= today),
    version: r.version,
  };
}

/** Upcoming meets soonest first, then past ones latest first. */
function orderMeets<T extends { date: string }>(list: T[], today: string): T[] {
  const upcoming = list.filter((m) => m.date >= today).sort((a, b) => a.date.localeCompare(b.date));
  const past = list.filter((m) => m.date < today).sort((a, b) => b.date.localeCompare(a.date));
  return [...upcoming, ...past];
}

async function toDtos(db: Queryable, teamId: number, rows: repo.AthleteRow[]): Promise<Athlete[]> {
  const ids = rows.map((r) => r.id);
  const [rs, ms, bws] = await Promise.all([
    repo.restrictionsOf(db, teamId, ids),
    repo.meetsOf(db, teamId, ids),
    repo.latestBodyweights(db, teamId, ids),
  ]);
  const today = todayIso();
  return rows.map((r) => ({
    id: r.id,
    name: r.name,
    sex: r.sex,
    birthYear: r.birthYear,
    division: r.division,
    maxRisk: r.maxRisk === null ? null : (r.maxRisk as 1 | 2 | 3),
    equipment: r.equipment,
    ruleOverrides: readRuleOverrides(r.ruleOverrides),
    notes: r.notes,
    archived: r.archivedAt !== null,
    account:
      r.userId !== null && r.accountEmail !== null
        ? { id: r.userId, name: r.accountName ?? '', email: r.accountEmail }
        : null,
    restrictions: rs.filter((x) => x.athleteId === r.id).map((x) => toRestrictionDto(x, today)),
    meets: orderMeets(
      ms
        .filter((m) => m.athleteId === r.id)
        .map((m) => ({ meetId: m.meetId, entryId: m.entryId, name: m.name, date: m.date, weightClass: m.weightClass })),
      today,
    ),
    latestBodyweight: bws.get(r.id) ?? null,
    version: r.version,
    updatedAt: r.updatedAt.toISOString(),
  }));
}

async function mustFind(db: Queryable, teamId: number, id: number) {
  const row = await repo.findAthlete(db, teamId, id);
  if (!row) throw new NotFoundError('That athlete');
  return row;
}

export async function getAthlete(ctx: AppContext, teamId: number, id: number): Promise<Athlete> {
  const db = ctx.database.db;
  const [dto] = await toDtos(db, teamId, [await mustFind(db, teamId, id)]);
  return dto!;
}

export async function listAthletes(
  ctx: AppContext,
  teamId: number,
  q: z.output<typeof athleteListQuery>,
): Promise<ListResponse<Athlete>> {
  const db = ctx.database.db;
  const { rows, total } = await repo.listAthletes(db, teamId, q);
  return { items: await toDtos(db, teamId, rows), total };
}

export async function listAccounts(ctx: AppContext, teamId: number): Promise<ListResponse<LinkableAccount>> {
  const rows = await repo.athleteAccounts(ctx.database.db, teamId);
  return { items: rows.map((r) => ({ ...r, athleteId: r.athleteId ?? null })), total: rows.length };
}

/** The account must be an athlete of this team and not linked to another roster entry. */
async function checkAccount(db: Queryable, teamId: number, userId: number, athleteId: number | null) {
  const account = await repo.findAthleteAccount(db, teamId, userId);
  if (!account) {
    throw new ValidationError('Pick an athlete account of your team.', {
      userId: ['No athlete account of your team has this id'],
    });
  }
  if (account.linkedTo !== null && account.linkedTo !== athleteId) {
    const msg = `This account is already linked to ${account.linkedName ?? 'another athlete'}`;
    throw new ValidationError(msg, { userId: [msg] });
  }
}

/** Two coaches linking one account at the same moment: the unique index decides, the loser hears why. */
async function linkGuard<T>(write: () => Promise<T>): Promise<T> {
  try {
    return await write();
  } catch (err) {
    if (!isDuplicateKey(err)) throw err;
    const msg = 'This account is already linked to another athlete';
    throw new ValidationError(msg, { userId: [msg] });
  }
}

export async function createAthlete(ctx: AppContext, auth: AuthContext, body: z.output<typeof athleteBody>) {
  const db = ctx.database.db;
  const { teamId } = auth;
  if (body.userId) await checkAccount(db, teamId, body.userId, null);
  const equipment = body.equipment ?? (await repo.gymEquipment(db, teamId));
  const id = await linkGuard(() =>
    repo.insertAthlete(db, teamId, {
      name: body.name,
      sex: body.sex,
      birthYear: body.birthYear,
      division: body.division,
      maxRisk: body.maxRisk ?? null,
      equipment,
      ruleOverrides: body.ruleOverrides,
      notes: body.notes,
      userId: body.userId ?? null,
    }),
  );
  return getAthlete(ctx, teamId, id);
}

const STALE =
  'Someone else changed this athlete since you opened the page. Their version is shown; apply your change again.';

export async function patchAthlete(
  ctx: AppContext,
  teamId: number,
  id: number,
  body: z.output<typeof athletePatchBody>,
) {
  const db = ctx.database.db;
  const current = await mustFind(db, teamId, id);
  if (current.version !== body.version) throw new ConflictError(STALE, await getAthlete(ctx, teamId, id));
  const { version, archived, ...fields } = body;
  if (fields.userId) await checkAccount(db, teamId, fields.userId, id);
  const values: repo.AthleteValues = { ...fields };
  if (archived !== undefined) values.archivedAt = archived ? (current.archivedAt ?? new Date()) : null;
  const ok = await linkGuard(() => repo.updateAthlete(db, teamId, id, version, values));
  const after = await getAthlete(ctx, teamId, id);
  if (!ok) throw new ConflictError(STALE, after);
  return after;
}

/** Athletes are never deleted here: their plans and results stay in the history. */
export async function archiveAthlete(ctx: AppContext, teamId: number, id: number) {
  const db = ctx.database.db;
  const current = await mustFind(db, teamId, id);
  if (current.archivedAt === null) {
    const ok = await repo.updateAthlete(db, teamId, id, current.version, { archivedAt: new Date() });
    if (!ok) throw new ConflictError(STALE, await getAthlete(ctx, teamId, id));
  }
  return getAthlete(ctx, teamId, id);
}

export async function addRestriction(
  ctx: AppContext,
  auth: AuthContext,
  athleteId: number,
  body: z.output<typeof restrictionBody>,
) {
  const db = ctx.database.db;
  await mustFind(db, auth.teamId, athleteId);
  const id = await repo.insertRestriction(db, {
    ...body,
    teamId: auth.teamId,
    athleteId,
    createdBy: auth.userId,
  });
  return toRestrictionDto((await repo.findRestriction(db, auth.teamId, athleteId, id))!);
}

async function mustFindRestriction(db: Queryable, teamId: number, athleteId: number, id: number) {
  const row = await repo.findRestriction(db, teamId, athleteId, id);
  if (!row) throw new NotFoundError('That restriction');
  return row;
}

const STALE_RESTRICTION =
  'Someone else changed this restriction since you opened it. Their version is shown; apply your change again.';

export async function patchRestriction(
  ctx: AppContext,
  teamId: number,
  athleteId: number,
  id: number,
  body: z.output<typeof restrictionPatchBody>,
) {
  const db = ctx.database.db;
  const current = await mustFindRestriction(db, teamId, athleteId, id);
  if (current.version !== body.version) throw new ConflictError(STALE_RESTRICTION, toRestrictionDto(current));
  const { version, ...fields } = body;
  // The edit is judged as the whole restriction it leaves behind.
  const merged = {
    joint: fields.joint === undefined ? current.joint : fields.joint,
    maxStress: fields.maxStress === undefined ? current.maxStress : fields.maxStress,
    emphasis: fields.emphasis ?? current.emphasis,
    families: fields.families ?? current.families,
    fromDate: fields.fromDate ?? current.fromDate,
    toDate: fields.toDate === undefined ? current.toDate : fields.toDate,
  };
  const problems = restrictionProblems(merged);
  if (Object.keys(problems).length) throw new ValidationError('Some fields need attention.', problems);
  const ok = await repo.updateRestriction(db, teamId, id, version, fields);
  const after = await mustFindRestriction(db, teamId, athleteId, id);
  if (!ok) throw new ConflictError(STALE_RESTRICTION, toRestrictionDto(after));
  return toRestrictionDto(after);
}

export async function removeRestriction(ctx: AppContext, teamId: number, athleteId: number, id: number) {
  const ok = await repo.deleteRestriction(ctx.database.db, teamId, athleteId, id);
  if (!ok) throw new NotFoundError('That restriction');
}

export async function athleteHistory(
  ctx: AppContext,
  teamId: number,
  athleteId: number,
  range: { from?: string | undefined; to?: string | undefined },
): Promise<AthleteHistory> {
  const db = ctx.database.db;
  await mustFind(db, teamId, athleteId);
  const { picks, sets, weights } = await repo.athleteHistory(db, teamId, athleteId, range);
  return {
    picks: picks.map((p) => ({
      id: p.id,
      week: p.week,
      slotId: p.slotId,
      variantId: p.variantId,
      variantName: p.variantName,
      variantArchived: p.variantArchivedAt !== null && p.variantArchivedAt !== undefined,
      lift: p.lift,
      family: p.family,
      source: p.source,
      pinned: p.pinned,
      reason: p.reason,
    })),
    topSets: sets.map((s) => ({
      ...s,
      weightKg: Number(s.weightKg),
      rpe: s.rpe === null ? null : Number(s.rpe),
      e1rmKg: Number(s.e1rmKg),
    })),
    bodyweights: weights.map((w) => ({ measuredOn: w.measuredOn, weightKg: Number(w.weightKg) })),
  };
}

/** Rest weeks are planned ahead: a week already over is history. */
function mustBePlannable(week: string) {
  const thisWeek = weekOfDate(new Date());
  if (week < thisWeek) {
    throw new ValidationError('Some fields need attention.', {
      week: [`Past weeks are history; use ${thisWeek} or later`],
    });
  }
}

/** Marks a rest or deload week; marking it again changes nothing. */
export async function markRestWeek(
  ctx: AppContext,
  auth: AuthContext,
  athleteId: number,
  week: string,
  db: Queryable = ctx.database.db,
): Promise<{ created: boolean; item: RestWeek }> {
  await mustFind(db, auth.teamId, athleteId);
  mustBePlannable(week);
  const before = await repo.findRestWeek(db, auth.teamId, athleteId, week);
  if (!before) await repo.insertRestWeek(db, { teamId: auth.teamId, athleteId, week, createdBy: auth.userId });
  const row = before ?? (await repo.findRestWeek(db, auth.teamId, athleteId, week))!;
  return { created: !before, item: { athleteId, week, createdAt: row.createdAt.toISOString() } };
}

/** Whether the athlete's week is marked a rest week for max effort (team-scoped). */
export async function isRestWeek(db: Queryable, teamId: number, athleteId: number, week: string): Promise<boolean> {
  return (await repo.findRestWeek(db, teamId, athleteId, week)) !== null;
}

export async function unmarkRestWeek(
  ctx: AppContext,
  teamId: number,
  athleteId: number,
  week: string,
  db: Queryable = ctx.database.db,
) {
  await mustFind(db, teamId, athleteId);
  mustBePlannable(week);
  if (!(await repo.deleteRestWeek(db, teamId, athleteId, week))) throw new NotFoundError('That rest week');
}

// Offered to other modules (meets, tissue, review, athlete scoping): the same reads, through this service.
/** One athlete's restrictions as the engines read them, each with the ISO weeks it covers (team-scoped). */
export async function engineRestrictionsOf(
  db: Queryable,
  teamId: number,
  athleteId: number,
): Promise<EngineRestriction[]> {
  return (await repo.restrictionsOf(db, teamId, [athleteId])).map((r) => engineRestriction(r));
}

export { findAthlete, findTeamAthlete, latestBodyweights } from './athletes.repository';

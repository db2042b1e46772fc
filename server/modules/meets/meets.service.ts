// Meets: who competes, in which weight class and division (checked against the federation's classes),
// and the attempt plans, with each entry's latest bodyweight and current max beside it.
import type { z } from 'zod';
import { WEIGHT_CLASSES, weightClass, type Division, type Sex } from '../../../shared/calc';
import { addWeeks, mondayOf, weekOfDate } from '../../../shared/engine/weeks';
import {
  CURRENT_MAX_MIN_SPECIFICITY,
  CURRENT_MAX_WEEKS,
  FRESH_MAX_WEEKS,
  pickCurrentMax,
  type CompetitionLift,
  type CurrentMax,
  type ListResponse,
  type Meet,
  type MeetEntry,
} from '../../../shared/schemas';
import type {
  meetBody,
  meetEntryBody,
  meetEntryPatchBody,
  meetListQuery,
  meetPatchBody,
} from '../../../shared/schemas/meets';
import { DIVISION_LABEL, SEX_LABEL } from '../../../shared/labels';
import type { Queryable } from '../../db/client';
import type { AppContext } from '../../context';
import { ConflictError, NotFoundError, ValidationError } from '../../lib/errors';
import { findAthlete, latestBodyweights, todayIso } from '../athletes/athletes.service';
import { isDuplicateKey } from '../../db/errors';
import * as repo from './meets.repository';

export function checkWeightClass(label: string | null | undefined, sex: Sex, division: Division) {
  if (!label) return;
  const allowed = WEIGHT_CLASSES[sex][division];
  if (!allowed.includes(label)) {
    const who = `${DIVISION_LABEL[division]} ${SEX_LABEL[sex]}`.toLowerCase();
    throw new ValidationError('Some fields need attention.', {
      weightClass: [`Not a weight class for ${who}: use ${allowed.join(', ')}`],
    });
  }
}

/** One athlete's top sets since `since` on variants close to a competition lift: what current maxes come from. */
export async function closeLiftSetsOf(db: Queryable, teamId: number, athleteId: number, since: string) {
  const rows = await repo.recentCompetitionSets(db, teamId, [athleteId], since, CURRENT_MAX_MIN_SPECIFICITY);
  return rows.map((s) => ({ ...s, weightKg: Number(s.weightKg), rpe: s.rpe === null ? null : Number(s.rpe) }));
}

async function toDtos(db: Queryable, teamId: number, rows: repo.MeetRow[]): Promise<Meet[]> {
  const entries = await repo.entriesOf(
    db,
    teamId,
    rows.map((r) => r.id),
  );
  const athleteIds = [...new Set(entries.map((e) => e.athleteId))];
  const weeksAgo = (n: number) =>
    mondayOf(addWeeks(weekOfDate(new Date()), -n))
      .toISOString()
      .slice(0, 10);
  const [weights, sets] = await Promise.all([
    latestBodyweights(db, teamId, athleteIds),
    repo.recentCompetitionSets(db, teamId, athleteIds, weeksAgo(CURRENT_MAX_WEEKS), CURRENT_MAX_MIN_SPECIFICITY),
  ]);
  const freshSince = weeksAgo(FRESH_MAX_WEEKS);
  const maxes = new Map<number, Record<CompetitionLift, CurrentMax | null>>();
  for (const id of athleteIds) {
    const mine = sets.filter((s) => s.athleteId === id);
    const of = (lift: CompetitionLift) =>
      pickCurrentMax(
        mine
          .filter((s) => s.lift === lift)
          .map((s) => ({ ...s, weightKg: Number(s.weightKg), rpe: s.rpe === null ? null : Number(s.rpe) })),
        freshSince,
      );
    maxes.set(id, { squat: of('squat'), bench: of('bench'), deadlift: of('deadlift') });
  }
  const dto = (e: (typeof entries)[number]): MeetEntry => {
    const bw = weights.get(e.athleteId) ?? null;
    return {
      id: e.id,
      meetId: e.meetId,
      athlete: { id: e.athleteId, name: e.athleteName, sex: e.athleteSex, division: e.athleteDivision },
      weightClass: e.weightClass,
      division: e.division,
      attempts: e.attempts,
      latestBodyweight: bw,
      suggestedClass: bw ? weightClass(bw.weightKg, e.athleteSex, { division: e.division }) : null,
      currentMax: maxes.get(e.athleteId) ?? { squat: null, bench: null, deadlift: null },
      version: e.version,
    };
  };
  return rows.map((m) => ({
    id: m.id,
    name: m.name,
    date: m.date,
    location: m.location,
    federation: m.federation,
    notes: m.notes,
    equipment: m.equipment,
    resultsSavedAt: m.resultsSavedAt ? m.resultsSavedAt.toISOString() : null,
    entries: entries.filter((e) => e.meetId === m.id).map(dto),
    version: m.version,
    updatedAt: m.updatedAt.toISOString(),
  }));
}

async function mustFind(db: Queryable, teamId: number, id: number) {
  const row = await repo.findMeet(db, teamId, id);
  if (!row) throw new NotFoundError('That meet');
  return row;
}

export async function getMeet(ctx: AppContext, teamId: number, id: number): Promise<Meet> {
  const db = ctx.database.db;
  const [dto] = await toDtos(db, teamId, [await mustFind(db, teamId, id)]);
  return dto!;
}

export async function listMeets(
  ctx: AppContext,
  teamId: number,
  q: z.output<typeof meetListQuery>,
): Promise<ListResponse<Meet>> {
  const db = ctx.database.db;
  const { rows, total } = await repo.listMeets(db, teamId, q, todayIso());
  return { items: await toDtos(db, teamId, rows), total };
}

export async function createMeet(ctx: AppContext, teamId: number, body: z.output<typeof meetBody>) {
  const id = await repo.insertMeet(ctx.database.db, teamId, body);
  return getMeet(ctx, teamId, id);
}

const STALE = 'Someone else changed this meet since you opened it. Their version is shown; apply your change again.';

export async function patchMeet(ctx: AppContext, teamId: number, id: number, body: z.output<typeof meetPatchBody>) {
  const db = ctx.database.db;
  const current = await mustFind(db, teamId, id);
  if (current.version !== body.version) throw new ConflictError(STALE, await getMeet(ctx, teamId, id));
  const { version, ...fields } = body;
  const ok = await repo.updateMeet(db, teamId, id, version, fields);
  const after = await getMeet(ctx, teamId, id);
  if (!ok) throw new ConflictError(STALE, after);
  return after;
}

export async function removeMeet(ctx: AppContext, teamId: number, id: number) {
  if (!(await repo.deleteMeet(ctx.database.db, teamId, id))) throw new NotFoundError('That meet');
}

function entryDto(meet: Meet, entryId: number): MeetEntry {
  const e = meet.entries.find((x) => x.id === entryId);
  if (!e) throw new NotFoundError('That entry');
  return e;
}

export async function addEntry(ctx: AppContext, teamId: number, meetId: number, body: z.output<typeof meetEntryBody>) {
  const db = ctx.database.db;
  await mustFind(db, teamId, meetId);
  const athlete = await findAthlete(db, teamId, body.athleteId);
  if (!athlete) {
    throw new ValidationError('Pick an athlete of your team.', { athleteId: ['No athlete of your team has this id'] });
  }
  if (athlete.archivedAt) {
    throw new ValidationError('That athlete is archived.', { athleteId: ['Restore the athlete before entering them'] });
  }
  const taken = 'This athlete is already entered in this meet';
  if (await repo.findEntryOf(db, teamId, meetId, athlete.id)) {
    throw new ValidationError(taken, { athleteId: [taken] });
  }
  const division = body.division ?? athlete.division;
  checkWeightClass(body.weightClass, athlete.sex, division);
  let id: number;
  try {
    id = await repo.insertEntry(db, {
      teamId,
      meetId,
      athleteId: athlete.id,
      weightClass: body.weightClass,
      division,
      attempts: body.attempts,
    });
  } catch (err) {
    if (isDuplicateKey(err)) throw new ValidationError(taken, { athleteId: [taken] });
    throw err;
  }
  return entryDto(await getMeet(ctx, teamId, meetId), id);
}

const STALE_ENTRY =
  'Someone else changed this entry since you opened it. Their version is shown; apply your change again.';

export async function patchEntry(
  ctx: AppContext,
  teamId: number,
  meetId: number,
  entryId: number,
  body: z.output<typeof meetEntryPatchBody>,
) {
  const db = ctx.database.db;
  const current = await repo.findEntry(db, teamId, meetId, entryId);
  if (!current) throw new NotFoundError('That entry');
  if (current.version !== body.version) {
    throw new ConflictError(STALE_ENTRY, entryDto(await getMeet(ctx, teamId, meetId), entryId));
  }
  const athlete = (await findAthlete(db, teamId, current.athleteId))!;
  const { version, ...fields } = body;
  const division = fields.division ?? current.division;
  // A division change can make the stored class wrong, so the class is checked whichever field changed.
  checkWeightClass(fields.weightClass === undefined ? current.weightClass : fields.weightClass, athlete.sex, division);
  const ok = await repo.updateEntry(db, teamId, entryId, version, fields);
  const after = entryDto(await getMeet(ctx, teamId, meetId), entryId);
  if (!ok) throw new ConflictError(STALE_ENTRY, after);
  return after;
}

export async function removeEntry(ctx: AppContext, teamId: number, meetId: number, entryId: number) {
  if (!(await repo.deleteEntry(ctx.database.db, teamId, meetId, entryId))) throw new NotFoundError('That entry');
}

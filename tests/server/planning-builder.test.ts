// One request builder for browser and server: the board's live check of a drop (built in the browser
// from the snapshot) and the server's answer to saving that pick (built from the stored rows) agree, cell
// by cell, for an athlete with a joint cap, a dated emphasis restriction, a risk ceiling and a rest week.
import { beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { addWeeks, explainCandidate, mondayOf, weekOfDate } from '../../shared/engine';
import { buildAthleteRequest } from '../../shared/planning';
import type { BoardData } from '../../shared/schemas';
import { loadPlanning, today } from '../../server/modules/plans/plans.context';
import { entriesOfAthletes } from '../../server/modules/plans/plans.repository';
import { buildBoardModel, cellKey, prepareRatings } from '../../src/features/board/model/board-model';
import { useTestApp } from '../support/app';
import {
  createAthlete,
  createPlanEntry,
  createRestriction,
  createTeam,
  createVariant,
  type TestTeam,
} from '../support/factories';

const t = useTestApp();
const db = () => t.ctx.database.db;
const thisWeek = weekOfDate(new Date());
const wk = (n: number) => addWeeks(thisWeek, n);
const day = (week: string, offset = 0) =>
  new Date(mondayOf(week).getTime() + offset * 86_400_000).toISOString().slice(0, 10);

let team: TestTeam;
let coach: request.Agent;
let athleteId: number;
let variants: Record<string, number>;

beforeAll(async () => {
  team = await createTeam(db());
  athleteId = await createAthlete(db(), team.teamId, { name: 'Same Answer', maxRisk: 2 });
  variants = {
    lockout: await createVariant(db(), team.teamId, {
      name: 'Lockout squat',
      family: 'lockout squat',
      emphasis: 'lockout',
      stress: { knee: 1 },
    }),
    elbow: await createVariant(db(), team.teamId, {
      name: 'Elbow-heavy squat',
      family: 'front squat',
      stress: { elbow: 2, knee: 1 },
    }),
    risky: await createVariant(db(), team.teamId, { name: 'Risky squat', family: 'risky', risk: 3 }),
    plain: await createVariant(db(), team.teamId, { name: 'Plain squat', family: 'plain', stress: { knee: 1 } }),
    pull: await createVariant(db(), team.teamId, {
      name: 'Plain pull',
      lift: 'deadlift',
      family: 'pull',
      stress: { lowerBack: 1 },
    }),
  };
  // A cap in force now, and no lockout work from the middle of week +3 to the middle of week +6.
  await createRestriction(db(), team.teamId, athleteId, { joint: 'elbow', maxStress: 1, fromDate: day(wk(-2)) });
  await createRestriction(db(), team.teamId, athleteId, {
    joint: null,
    maxStress: null,
    emphasis: ['lockout'],
    fromDate: day(wk(3), 2),
    toDate: day(wk(6), 3),
  });
  // The plain squat sits in week +2, so the repeat window judges it in nearby weeks.
  await createPlanEntry(db(), team.teamId, athleteId, variants.plain!, { week: wk(2) });
  coach = await t.signIn(team.coach.email);
  await coach.put(`/api/athletes/${athleteId}/rest-weeks/${wk(5)}`).expect(201);
});

describe('browser and server judge a cell the same way', () => {
  it('gives the same rule breaks for every candidate in every week, from the snapshot and from the rows', async () => {
    const board = (await coach.get(`/api/board?from=${thisWeek}&to=${wk(8)}`)).body as BoardData;
    const model = buildBoardModel(board);
    const planning = await loadPlanning(db(), team.teamId, { today: today() });
    const rows = await entriesOfAthletes(db(), team.teamId, [athleteId]);

    let compared = 0;
    for (const n of [1, 3, 4, 6, 7]) {
      for (const [, variantId] of Object.entries(variants)) {
        const cell = { athleteId, week: wk(n), slotId: 'lower' };
        // Browser: the drag's rating of this drop.
        const rating = prepareRatings(model, { kind: 'library', variantId }).get(
          cellKey(athleteId, cell.week, cell.slotId),
        )!;
        // Server: the request the save path builds, over the week being saved, from the stored rows.
        const request = buildAthleteRequest(planning, athleteId, {
          weeks: [cell.week],
          entries: rows.filter((r) => !(r.week === cell.week && r.slotId === cell.slotId)),
        })!;
        const server = explainCandidate(request, String(athleteId), cell.week, cell.slotId, String(variantId));
        expect(rating.breaks, `${cell.week} ${variantId}`).toEqual(server.map((v) => v.message));
        compared++;
      }
    }
    expect(compared).toBe(25);
  });

  it('answers a save with the same breaks the board showed while dragging', async () => {
    const board = (await coach.get(`/api/board?from=${thisWeek}&to=${wk(8)}`)).body as BoardData;
    const model = buildBoardModel(board);
    // Each clean save is cleared again, so every candidate meets the same board.
    let version = 0;
    let saved = 0;
    for (const [name, variantId] of Object.entries(variants)) {
      const week = wk(1);
      const rating = prepareRatings(model, { kind: 'library', variantId }).get(cellKey(athleteId, week, 'lower'))!;
      const res = await coach.put(`/api/plans/${athleteId}/${week}/lower`).send({ variantId, version });
      if (rating.breaks.length) {
        expect(res.status, name).toBe(422);
        expect(res.body.error.violations.map((v: { message: string }) => v.message)).toEqual(rating.breaks);
      } else {
        expect([200, 201], name).toContain(res.status);
        const cleared = await coach.delete(`/api/plans/${athleteId}/${week}/lower?version=${res.body.version}`);
        expect(cleared.status).toBe(200);
        version = cleared.body.version;
        saved++;
      }
    }
    expect(saved).toBeGreaterThan(0);
    // The elbow cap is in force now, so that drop breaks on both sides.
    const elbow = prepareRatings(model, { kind: 'library', variantId: variants.elbow! }).get(
      cellKey(athleteId, wk(1), 'lower'),
    )!;
    expect(elbow.breaks.length).toBeGreaterThan(0);
  });
});

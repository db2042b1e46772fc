// Connective-tissue work per athlete and week: generated from the team's settings and stored once,
// check-ins validated and stored, pain turning into a suggestion the coach sees.
import { beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { and, eq } from 'drizzle-orm';
import { DEFAULT_TISSUE_RULES, prescribeTissueWork } from '../../shared/engine/tissue';
import { addWeeks, mondayOf, weekOfDate } from '../../shared/engine/weeks';
import { isoDay } from '../../server/lib/days';
import { DEFAULT_TEAM_RULES } from '../../shared/schemas/rules';
import { teamRules, tissuePrescriptions } from '../../server/db/schema';
import { tissueWorkFor } from '../../server/modules/tissue/tissue.service';
import { useTestApp } from '../support/app';
import { createPlanEntry, createRestriction, createTeam, createVariant, type TestTeam } from '../support/factories';

const t = useTestApp();
const thisWeek = weekOfDate(new Date());
let team: TestTeam;
let athlete: request.Agent;

beforeAll(async () => {
  const db = t.ctx.database.db;
  team = await createTeam(db);
  // The team works wrists first; this week's pick loads the wrist and the elbow.
  await db
    .update(teamRules)
    .set({
      rules: {
        ...DEFAULT_TEAM_RULES,
        tissue: { ...DEFAULT_TEAM_RULES.tissue, focusJoints: ['wrist', 'knee'] },
      } as unknown as Record<string, unknown>,
    })
    .where(eq(teamRules.teamId, team.teamId));
  const press = await createVariant(db, team.teamId, { lift: 'bench', stress: { elbow: 3, wrist: 2 } });
  await createPlanEntry(db, team.teamId, team.athleteId, press, { week: thisWeek, slotId: 'upper' });
  await createPlanEntry(db, team.teamId, team.athleteId, press, { week: addWeeks(thisWeek, 1), slotId: 'upper' });
  athlete = await t.signIn(team.athleteUser.email);
});

describe('tissueWorkFor', () => {
  it('generates the week from the team settings and the week’s picks, and stores it once', async () => {
    const db = t.ctx.database.db;
    const first = await tissueWorkFor(t.ctx, team.teamId, team.athleteId, thisWeek);
    // The same inputs through the pure module: focus joints first, then the loaded elbow, at most three.
    const expected = prescribeTissueWork({
      week: thisWeek,
      rules: { ...DEFAULT_TISSUE_RULES },
      history: [],
      checkins: [],
      focusJoints: ['wrist', 'knee'],
      jointLoad: { elbow: 3, wrist: 2 },
    });
    expect(first.items).toEqual(expected.items);
    expect(first.items.map((i) => i.joint)).toEqual(['wrist', 'knee', 'elbow']);
    expect(first.kind).toBe('highRep');
    expect(first.notes).toEqual(expect.arrayContaining(['Stop on sharp or unusual pain.']));
    const again = await tissueWorkFor(db, team.teamId, team.athleteId, thisWeek);
    expect(again.items).toEqual(first.items);
    const rows = await db
      .select()
      .from(tissuePrescriptions)
      .where(and(eq(tissuePrescriptions.athleteId, team.athleteId), eq(tissuePrescriptions.week, thisWeek)));
    expect(rows).toHaveLength(1);
  });

  it('stores only this week and next, and refuses another team’s athlete', async () => {
    const other = await createTeam(t.ctx.database.db);
    const past = await tissueWorkFor(t.ctx, team.teamId, team.athleteId, addWeeks(thisWeek, -5));
    expect(past.items.length).toBeGreaterThan(0);
    const rows = await t.ctx.database.db
      .select()
      .from(tissuePrescriptions)
      .where(eq(tissuePrescriptions.week, addWeeks(thisWeek, -5)));
    expect(rows.filter((r) => r.athleteId === team.athleteId)).toHaveLength(0);
    await tissueWorkFor(t.ctx, team.teamId, team.athleteId, addWeeks(thisWeek, 3));
    const ahead = await t.ctx.database.db
      .select()
      .from(tissuePrescriptions)
      .where(
        and(eq(tissuePrescriptions.athleteId, team.athleteId), eq(tissuePrescriptions.week, addWeeks(thisWeek, 3))),
      );
    expect(ahead).toHaveLength(0);
    await expect(tissueWorkFor(t.ctx, team.teamId, other.athleteId, thisWeek)).rejects.toMatchObject({ status: 404 });
  });
});

describe('POST /api/tissue/checkins', () => {
  it('answers field errors, and refuses a week to come or long gone', async () => {
    const bad = await athlete
      .post('/api/tissue/checkins')
      .send({ week: '2027-W60', soreness: 11, painJoints: ['toe'] });
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['painJoints.0', 'soreness', 'week']);
    const future = await athlete
      .post('/api/tissue/checkins')
      .send({ week: addWeeks(thisWeek, 1), soreness: 0, painJoints: [] });
    expect(future.body.error.fields.week[0]).toMatch(/not come/);
    const old = await athlete
      .post('/api/tissue/checkins')
      .send({ week: addWeeks(thisWeek, -6), soreness: 0, painJoints: [] });
    expect(old.body.error.fields.week[0]).toMatch(/at most 2 weeks/);
  });

  it('stores a check-in with the week’s kind, shows it on the week page, and regenerates next week', async () => {
    const db = t.ctx.database.db;
    await tissueWorkFor(t.ctx, team.teamId, team.athleteId, addWeeks(thisWeek, 1)); // e.g. generated for an e-mail
    const res = await athlete
      .post('/api/tissue/checkins')
      .send({ week: thisWeek, soreness: 2, painJoints: ['elbow', 'elbow'], note: 'Elbow twinged on the last set' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ week: thisWeek, kind: 'highRep', soreness: 2, painJoints: ['elbow'] });
    const next = await db
      .select()
      .from(tissuePrescriptions)
      .where(
        and(eq(tissuePrescriptions.athleteId, team.athleteId), eq(tissuePrescriptions.week, addWeeks(thisWeek, 1))),
      );
    expect(next).toHaveLength(0);
    const week = await athlete.get('/api/my-week');
    expect(week.body.checkins[0]).toMatchObject({ week: thisWeek, kind: 'highRep' });
    expect(week.body.checkins[0].done[0].note).toBe('Elbow twinged on the last set');
  });

  it('turns pain on a joint into a suggestion on the coach’s review, and pauses that joint next week', async () => {
    const coach = await t.signIn(team.coach.email);
    const review = await coach.get(`/api/athletes/${team.athleteId}/review`);
    expect(review.status).toBe(200);
    expect(review.body.suggestions).toEqual([
      expect.objectContaining({
        joint: 'elbow',
        message: expect.stringMatching(/Consider adding a restriction on the elbow/),
      }),
    ]);
    expect(review.body.checkins[0]).toMatchObject({ painJoints: ['elbow'] });
    const next = await tissueWorkFor(t.ctx, team.teamId, team.athleteId, addWeeks(thisWeek, 1));
    expect(next.items.map((i) => i.joint)).not.toContain('elbow');
    expect(next.notes.join(' ')).toMatch(/No work on the elbow this week/);
  });
});

describe('restrictions', () => {
  it('keep a joint restricted that week out of the tissue work, stored or not, on My week too', async () => {
    const db = t.ctx.database.db;
    const own = await createTeam(db);
    const before = await tissueWorkFor(t.ctx, own.teamId, own.athleteId, thisWeek);
    expect(before.items.map((i) => i.joint)).toEqual(['elbow', 'knee', 'shoulder']);
    const me = await t.signIn(own.athleteUser.email);
    expect((await me.get('/api/my-week')).body.tissue.items.map((i: { joint: string }) => i.joint)).toContain('elbow');

    // The coach restricts the elbow from this week's Monday for two weeks, after the week was stored.
    const monday = isoDay(mondayOf(thisWeek));
    const until = isoDay(mondayOf(addWeeks(thisWeek, 1)));
    const coach = await t.signIn(own.coach.email);
    const added = await coach
      .post(`/api/athletes/${own.athleteId}/restrictions`)
      .send({ joint: 'elbow', maxStress: 1, fromDate: monday, toDate: until });
    expect(added.status).toBe(201);

    const note = `No work on the elbow this week: the athlete has a restriction on it (${thisWeek} to ${addWeeks(thisWeek, 1)}).`;
    const during = await tissueWorkFor(t.ctx, own.teamId, own.athleteId, thisWeek);
    expect(during.items.map((i) => i.joint)).toEqual(['knee', 'shoulder']);
    expect(during.notes).toContain(note);
    const page = (await me.get('/api/my-week')).body;
    expect(page.tissue.items.map((i: { joint: string }) => i.joint)).toEqual(['knee', 'shoulder']);
    expect(page.tissue.notes).toContain(note);
    const next = await tissueWorkFor(t.ctx, own.teamId, own.athleteId, addWeeks(thisWeek, 1));
    expect(next.items.map((i) => i.joint)).not.toContain('elbow');
    // After it ends the elbow is worked again.
    const after = await tissueWorkFor(t.ctx, own.teamId, own.athleteId, addWeeks(thisWeek, 2));
    expect(after.items.map((i) => i.joint)).toContain('elbow');
    // A row under another team, even naming this athlete, is not read: the reads are scoped to the team.
    await createRestriction(db, team.teamId, own.athleteId, { joint: 'knee', fromDate: monday });
    expect((await tissueWorkFor(t.ctx, own.teamId, own.athleteId, thisWeek)).items.map((i) => i.joint)).toEqual([
      'knee',
      'shoulder',
    ]);
  });
});

describe('sessions a week', () => {
  it('carries the team’s weekly session count on every item, on My week and the coach’s review', async () => {
    const db = t.ctx.database.db;
    const own = await createTeam(db);
    await db
      .update(teamRules)
      .set({
        rules: {
          ...DEFAULT_TEAM_RULES,
          tissue: { ...DEFAULT_TEAM_RULES.tissue, sessionsPerWeek: 2 },
        } as unknown as Record<string, unknown>,
      })
      .where(eq(teamRules.teamId, own.teamId));
    const me = await t.signIn(own.athleteUser.email);
    const page = (await me.get('/api/my-week')).body;
    expect(page.tissue.items.length).toBeGreaterThan(0);
    expect(page.tissue.items.map((i: { sessionsPerWeek: number }) => i.sessionsPerWeek)).toEqual(
      page.tissue.items.map(() => 2),
    );
    const review = await (await t.signIn(own.coach.email)).get(`/api/athletes/${own.athleteId}/review`);
    expect(review.status).toBe(200);
    expect(review.body.tissue).toMatchObject({ week: thisWeek, items: page.tissue.items });
  });

  it('reads items stored before the count existed as three a week', async () => {
    const db = t.ctx.database.db;
    const own = await createTeam(db);
    const { sessionsPerWeek: _n, ...old } = (await tissueWorkFor(db, own.teamId, own.athleteId, thisWeek)).items[0]!;
    await db
      .update(tissuePrescriptions)
      .set({ items: [old] })
      .where(and(eq(tissuePrescriptions.athleteId, own.athleteId), eq(tissuePrescriptions.week, thisWeek)));
    const again = await tissueWorkFor(db, own.teamId, own.athleteId, thisWeek);
    expect(again.items).toEqual([{ ...old, sessionsPerWeek: 3 }]);
  });
});

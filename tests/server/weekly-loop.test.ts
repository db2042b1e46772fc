// The weekly loop: weeks stay drafts until published, the check before publishing (dry run: nothing stored
// or sent, counts that match their lists), updates that name what changed, a cell's ranked alternatives,
// and a save that answers with every other cell whose status it changed.
import { beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { and, eq, like } from 'drizzle-orm';
import { addWeeks, weekOfDate } from '../../shared/engine/weeks';
import { athleteWeekPublications, outbox, planEntries } from '../../server/db/schema';
import { inboxClient } from '../../server/standins/smtp';
import { useTestApp } from '../support/app';
import {
  createAthlete,
  createPlanEntry,
  createPlanLibrary,
  createTeam,
  createUser,
  createVariant,
  type TestTeam,
} from '../support/factories';

const t = useTestApp();
const inbox = inboxClient();
const db = () => t.ctx.database.db;
const thisWeek = weekOfDate(new Date());
const next = addWeeks(thisWeek, 1);

interface ListOf<T> {
  count: number;
  items: T[];
}

describe('drafts, the check and publishing', () => {
  let team: TestTeam;
  let coach: request.Agent;
  let athlete: request.Agent;
  let lib: Awaited<ReturnType<typeof createPlanLibrary>>;
  let noAccount: number;
  let withAccountNoPicks: { id: number; email: string };

  beforeAll(async () => {
    team = await createTeam(db());
    lib = await createPlanLibrary(db(), team.teamId, 4);
    coach = await t.signIn(team.coach.email);
    athlete = await t.signIn(team.athleteUser.email);
    noAccount = await createAthlete(db(), team.teamId, { name: 'Aaron Noaccount' });
    const user = await createUser(db(), team.teamId, 'athlete');
    await createAthlete(db(), team.teamId, { name: 'Beth Emptyweek', userId: user.id });
    withAccountNoPicks = user;
    // Next week: the linked athlete has both slots; the athlete without an account has the lower slot only.
    await createPlanEntry(db(), team.teamId, team.athleteId, lib.squat[0]!, { week: next, slotId: 'lower' });
    await createPlanEntry(db(), team.teamId, team.athleteId, lib.bench[0]!, { week: next, slotId: 'upper' });
    await createPlanEntry(db(), team.teamId, noAccount, lib.squat[1]!, { week: next, slotId: 'lower' });
    // A coach pick that breaks the repeat window without a reason (the same variant this week and next).
    await createPlanEntry(db(), team.teamId, noAccount, lib.squat[1]!, {
      week: thisWeek,
      slotId: 'lower',
      source: 'coach',
      pinned: true,
    });
  });

  it('a draft week shows the athlete nothing but that the coach is still planning', async () => {
    const res = await athlete.get(`/api/my-week?week=${next}`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ week: next, published: false, picks: [] });
  });

  it('the dry run lists what is missing, with counts that match, and stores and sends nothing', async () => {
    const res = await coach.post(`/api/weeks/${next}/publish`).send({ dryRun: true });
    expect(res.status).toBe(200);
    const body = res.body as Record<string, ListOf<Record<string, unknown>>>;
    for (const key of ['emptyCells', 'unexplainedBreaks', 'withoutAccount', 'wouldEmail']) {
      expect(body[key]!.count).toBe(body[key]!.items.length);
    }
    // Beth has no pick in either slot; Aaron none in the upper slot.
    expect(body.emptyCells!.items).toEqual(
      expect.arrayContaining([
        expect.objectContaining({ athleteName: 'Aaron Noaccount', slotId: 'upper', slotLabel: 'Upper max effort' }),
        expect.objectContaining({ athleteName: 'Beth Emptyweek', slotId: 'lower' }),
        expect.objectContaining({ athleteName: 'Beth Emptyweek', slotId: 'upper' }),
      ]),
    );
    expect(body.emptyCells!.count).toBe(3);
    expect(body.unexplainedBreaks!.items).toEqual([
      expect.objectContaining({
        athleteId: noAccount,
        slotId: 'lower',
        messages: expect.arrayContaining([expect.stringMatching(/repeat window/)]),
      }),
    ]);
    expect(body.withoutAccount!.items).toEqual([expect.objectContaining({ athleteId: noAccount })]);
    // An e-mail only to the athlete with picks: an empty week sends no "no work" e-mail.
    expect(body.wouldEmail!.items).toEqual([
      expect.objectContaining({ athleteId: team.athleteId, email: team.athleteUser.email, kind: 'plan' }),
    ]);

    const stored = await db()
      .select()
      .from(athleteWeekPublications)
      .where(eq(athleteWeekPublications.teamId, team.teamId));
    expect(stored).toHaveLength(0);
    const queued = await db()
      .select()
      .from(outbox)
      .where(and(eq(outbox.teamId, team.teamId), like(outbox.dedupeKey, 'weekly:%')));
    expect(queued).toHaveLength(0);
    expect((await athlete.get(`/api/my-week?week=${next}`)).body.published).toBe(false);
  });

  it('publishing shows the athlete the picks and e-mails only who has something to read', async () => {
    const res = await coach.post(`/api/weeks/${next}/publish`).send({});
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ published: true, alreadyPublished: false, athletesPublished: 3, emailsQueued: 1 });
    const mine = await athlete.get(`/api/my-week?week=${next}`);
    expect(mine.body.published).toBe(true);
    expect(mine.body.picks.map((p: { variant: { id: number } }) => p.variant.id)).toEqual([lib.squat[0], lib.bench[0]]);
    const [mail] = await inbox.waitFor(team.athleteUser.email);
    expect(mail!.subject).toMatch(/^Your week of/);
    await t.ctx.services.mail.sendDue();
    expect(await inbox.list({ to: withAccountNoPicks.email })).toHaveLength(0);
  });

  it('publishing again after a change sends an update naming the change; with no change, nothing', async () => {
    const [row] = await db()
      .select()
      .from(planEntries)
      .where(
        and(eq(planEntries.athleteId, team.athleteId), eq(planEntries.week, next), eq(planEntries.slotId, 'upper')),
      );
    const save = await coach
      .put(`/api/plans/${team.athleteId}/${next}/upper`)
      .send({ variantId: lib.bench[2], version: row!.version });
    expect(save.status).toBe(200);

    const check = await coach.post(`/api/weeks/${next}/publish`).send({ dryRun: true });
    expect(check.body.wouldEmail.items).toEqual([
      expect.objectContaining({
        athleteId: team.athleteId,
        kind: 'update',
        changes: [expect.stringMatching(/^Upper max effort: bench variant 2 .* instead of bench variant 0/)],
      }),
    ]);
    const again = await coach.post(`/api/weeks/${next}/publish`).send({});
    expect(again.status).toBe(201);
    expect(again.body).toMatchObject({ athletesPublished: 1, emailsQueued: 1 });
    const mails = await inbox.waitFor(team.athleteUser.email, { count: 2 });
    const update = mails.find((m) => m.subject.startsWith('Updated:'))!;
    expect(update.text).toContain('What changed');
    expect(update.text).toMatch(/Upper max effort: bench variant 2 .* instead of bench variant 0/);

    const third = await coach.post(`/api/weeks/${next}/publish`).send({});
    expect(third.status).toBe(200);
    expect(third.body).toMatchObject({ alreadyPublished: true, athletesPublished: 0, emailsQueued: 0 });
    const mine = await athlete.get(`/api/my-week?week=${next}`);
    expect(mine.body.picks.map((p: { variant: { id: number } }) => p.variant.id)).toContain(lib.bench[2]);
  });

  it('another team publishing the same week touches nothing of this team', async () => {
    const other = await createTeam(db());
    const otherCoach = await t.signIn(other.coach.email);
    const res = await otherCoach.post(`/api/weeks/${next}/publish`).send({ dryRun: true });
    expect(res.body.withoutAccount.count).toBe(0);
    expect(JSON.stringify(res.body)).not.toContain('Noaccount');
  });
});

describe('What fits here', () => {
  let team: TestTeam;
  let coach: request.Agent;
  let lib: Awaited<ReturnType<typeof createPlanLibrary>>;

  beforeAll(async () => {
    team = await createTeam(db());
    lib = await createPlanLibrary(db(), team.teamId, 4);
    coach = await t.signIn(team.coach.email);
    // This week's lower pick: next week it would repeat (variant) and crowd its family (2-week window).
    await createPlanEntry(db(), team.teamId, team.athleteId, lib.squat[0]!, { week: thisWeek, slotId: 'lower' });
  });

  it('ranks the library for the cell: clean, then warning, then break, each with reasons', async () => {
    const res = await coach.get(`/api/plans/${team.athleteId}/${next}/lower/alternatives`);
    expect(res.status).toBe(200);
    const items = res.body.items as { variantId: number; status: string; reasons: string[]; rules: string[] }[];
    // Every squat and deadlift variant, no bench one (the slot does not take it).
    expect(items).toHaveLength(8);
    expect(items.map((i) => i.variantId)).not.toContain(lib.bench[0]);
    const order = { clean: 0, warning: 1, break: 2 } as Record<string, number>;
    const ranks = items.map((i) => order[i.status]!);
    expect(ranks).toEqual([...ranks].sort((a, b) => a - b));
    const repeat = items.find((i) => i.variantId === lib.squat[0])!;
    expect(repeat.status).toBe('break');
    expect(repeat.rules).toEqual(expect.arrayContaining(['repeat']));
    expect(repeat.reasons.length).toBeGreaterThan(0);
    for (const i of items) expect(i.reasons.length).toBeGreaterThan(0);
    expect(res.body.summary.clean).toBe(items.filter((i) => i.status === 'clean').length);
  });

  it('says which rules block when nothing is clean', async () => {
    const lone = await createTeam(db());
    const only = await createVariant(db(), lone.teamId, { lift: 'bench', family: 'pin press', stress: { elbow: 1 } });
    await createPlanEntry(db(), lone.teamId, lone.athleteId, only, { week: thisWeek, slotId: 'upper' });
    const agent = await t.signIn(lone.coach.email);
    const res = await agent.get(`/api/plans/${lone.athleteId}/${next}/upper/alternatives`);
    expect(res.body.items).toEqual([expect.objectContaining({ variantId: only, status: 'break' })]);
    expect(res.body.summary).toMatchObject({ clean: 0, break: 1 });
    expect(res.body.summary.blockedBy.map((b: { rule: string }) => b.rule)).toEqual(
      expect.arrayContaining(['repeat', 'family']),
    );
  });

  it('another team’s athlete is not found; an athlete may not ask; a bad cell is a 422', async () => {
    const other = await createTeam(db());
    const otherCoach = await t.signIn(other.coach.email);
    const res = await otherCoach.get(`/api/plans/${team.athleteId}/${next}/lower/alternatives`);
    expect(res.status).toBe(404);
    expect(res.body.error.message).toMatch(/athlete/i);
    const athlete = await t.signIn(team.athleteUser.email);
    expect((await athlete.get(`/api/plans/${team.athleteId}/${next}/lower/alternatives`)).status).toBe(403);
    const bad = await coach.get(`/api/plans/${team.athleteId}/2027-W77/lower/alternatives`);
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields['params.week']).toBeDefined();
    expect((await coach.get(`/api/plans/${team.athleteId}/${next}/middle/alternatives`)).status).toBe(404);
  });
});

describe('a save answers with the other cells whose status it changed', () => {
  it('an override next week turns this week’s engine pick into a break, and says so', async () => {
    const team = await createTeam(db());
    const lib = await createPlanLibrary(db(), team.teamId, 3);
    const coach = await t.signIn(team.coach.email);
    await createPlanEntry(db(), team.teamId, team.athleteId, lib.squat[0]!, { week: thisWeek, slotId: 'lower' });
    const res = await coach.post('/api/plans/batch').send({
      changes: [
        {
          athleteId: team.athleteId,
          week: next,
          slotId: 'lower',
          variantId: lib.squat[0],
          version: 0,
          reason: 'Meet rehearsal on the competition squat',
        },
      ],
    });
    expect(res.status).toBe(200);
    expect(res.body.affected).toEqual([
      expect.objectContaining({
        athleteId: team.athleteId,
        week: thisWeek,
        slotId: 'lower',
        variantId: lib.squat[0],
        from: 'clean',
        to: 'break',
        reasons: expect.arrayContaining([expect.any(String)]),
      }),
    ]);
  });

  it('a stale version is refused with what is there now, and nothing is lost', async () => {
    const team = await createTeam(db());
    const lib = await createPlanLibrary(db(), team.teamId, 3);
    const coach = await t.signIn(team.coach.email);
    const head = await t.signIn(team.headCoach.email);
    await createPlanEntry(db(), team.teamId, team.athleteId, lib.squat[0]!, { week: next, slotId: 'lower' });
    const first = await head
      .put(`/api/plans/${team.athleteId}/${next}/lower`)
      .send({ variantId: lib.squat[1], version: 1 });
    expect(first.status).toBe(200);
    const stale = await coach.post('/api/plans/batch').send({
      changes: [
        { athleteId: team.athleteId, week: next, slotId: 'lower', variantId: lib.squat[2], version: 1 },
        { athleteId: team.athleteId, week: next, slotId: 'upper', variantId: lib.bench[0], version: 0 },
      ],
    });
    expect(stale.status).toBe(409);
    expect(stale.body.error.message).toMatch(/changed this cell/);
    const rows = await db().select().from(planEntries).where(eq(planEntries.athleteId, team.athleteId));
    // The head coach's save stands and the batch wrote nothing, not even its other cell.
    expect(rows).toEqual([expect.objectContaining({ slotId: 'lower', variantId: lib.squat[1], version: 2 })]);
  });
});

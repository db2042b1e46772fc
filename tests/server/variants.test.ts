// The exercise library API: list filters and sorting, create and edit with field errors and versions,
// another team's ids, and archive-instead-of-delete once a variant is in someone's history.
import { beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { useTestApp } from '../support/app';
import { createPlanEntry, createTeam, createTopSet, createVariant, uniq, type TestTeam } from '../support/factories';

const t = useTestApp();
let team: TestTeam;
let other: TestTeam;
let coach: request.Agent;
let otherCoach: request.Agent;
let athlete: request.Agent;

const tag = uniq();
const valid = (name: string) => ({
  name,
  lift: 'bench',
  family: 'board press',
  bar: 'straight',
  equipment: ['boards'],
  emphasis: 'lockout',
  stress: { elbow: 3, wrist: 1, shoulder: 0 },
  risk: 2,
  specificity: 0.5,
  scheme: 'triple',
  notes: '  Touch the board, no bounce.  ',
});

beforeAll(async () => {
  const db = t.ctx.database.db;
  team = await createTeam(db);
  other = await createTeam(db);
  await createVariant(db, team.teamId, {
    name: `Box squat low ${tag}`,
    family: 'box squat',
    equipment: ['box'],
    risk: 2,
    specificity: 0.5,
  });
  await createVariant(db, team.teamId, {
    name: `Box squat high ${tag}`,
    family: 'box squat',
    equipment: ['box', 'bands'],
    risk: 1,
    specificity: 0.4,
  });
  await createVariant(db, team.teamId, {
    name: `Floor press ${tag}`,
    lift: 'bench',
    family: 'floor press',
    equipment: [],
    risk: 1,
    specificity: 0.3,
    stress: { elbow: 2 },
    notes: 'Pause with the triceps on the floor: 100% still.',
  });
  await createVariant(db, team.teamId, {
    name: `Rack pull ${tag}`,
    lift: 'deadlift',
    family: 'rack pull',
    equipment: ['rack pins'],
    risk: 3,
    specificity: 0.5,
  });
  await createVariant(db, other.teamId, { name: `Other team's squat ${tag}` });
  coach = await t.signIn(team.coach.email);
  otherCoach = await t.signIn(other.headCoach.email);
  athlete = await t.signIn(team.athleteUser.email);
});

const names = (res: request.Response) => (res.body.items as { name: string }[]).map((v) => v.name);

describe('GET /api/variants', () => {
  it('lists the team’s variants, sorted by name, as { items, total }', async () => {
    const res = await coach.get('/api/variants');
    expect(res.status).toBe(200);
    expect(res.body.total).toBe(4);
    expect(names(res)).toEqual([...names(res)].sort((a, b) => a.localeCompare(b)));
    expect(names(res)).not.toContain(`Other team's squat ${tag}`);
    expect(res.body.items[0]).toMatchObject({ archived: false, inHistory: false, version: 1 });
  });

  it('filters by lift, family, equipment, risk and text', async () => {
    expect(names(await coach.get('/api/variants?lift=bench'))).toEqual([`Floor press ${tag}`]);
    expect((await coach.get('/api/variants?family=box%20squat')).body.total).toBe(2);
    expect(names(await coach.get('/api/variants?equipment=bands'))).toEqual([`Box squat high ${tag}`]);
    expect(names(await coach.get('/api/variants?equipment=none'))).toEqual([`Floor press ${tag}`]);
    expect(names(await coach.get('/api/variants?risk=3'))).toEqual([`Rack pull ${tag}`]);
    expect((await coach.get('/api/variants?risk=1,2')).body.total).toBe(3);
    expect(names(await coach.get('/api/variants?q=RACK'))).toEqual([`Rack pull ${tag}`]);
    // Searches notes too, and takes % literally.
    expect(names(await coach.get('/api/variants?q=100%25'))).toEqual([`Floor press ${tag}`]);
    expect((await coach.get('/api/variants?q=%25%25%25')).body.total).toBe(0);
  });

  it('sorts either way and pages with limit and offset', async () => {
    const byRisk = await coach.get('/api/variants?sort=-risk');
    expect(byRisk.body.items[0].name).toBe(`Rack pull ${tag}`);
    const bySpec = await coach.get('/api/variants?sort=specificity');
    expect(bySpec.body.items[0].name).toBe(`Floor press ${tag}`);
    const page = await coach.get('/api/variants?limit=2&offset=2&sort=name');
    expect(page.body.total).toBe(4);
    expect(names(page)).toEqual(names(await coach.get('/api/variants?sort=name')).slice(2, 4));
  });

  it('reports bad filters as field errors', async () => {
    const res = await coach.get('/api/variants?lift=clean&risk=7&sort=colour&limit=0');
    expect(res.status).toBe(422);
    const keys = Object.keys(res.body.error.fields);
    expect(keys).toEqual(expect.arrayContaining(['query.lift', 'query.sort', 'query.limit']));
    expect(keys.some((k) => k.startsWith('query.risk'))).toBe(true);
  });

  it('refuses athletes', async () => {
    expect((await athlete.get('/api/variants')).status).toBe(403);
  });
});

describe('GET /api/variants/facets', () => {
  it('lists the families, bars and equipment in use, for filters and suggestions', async () => {
    const res = await coach.get('/api/variants/facets');
    expect(res.status).toBe(200);
    expect(res.body.families).toEqual(['box squat', 'floor press', 'rack pull']);
    expect(res.body.equipment).toEqual(['bands', 'box', 'rack pins']);
  });
});

describe('POST /api/variants', () => {
  it('creates a variant, trimming text and dropping zero stresses', async () => {
    const res = await coach.post('/api/variants').send(valid(`Board press 2 ${tag}`));
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      name: `Board press 2 ${tag}`,
      stress: { elbow: 3, wrist: 1 },
      notes: 'Touch the board, no bounce.',
      specificity: 0.5,
      scheme: 'triple',
      version: 1,
      archived: false,
    });
    expect(res.body.stress).not.toHaveProperty('shoulder');
    expect((await coach.get(`/api/variants/${res.body.id}`)).body.name).toBe(`Board press 2 ${tag}`);
  });

  it('answers every invalid field by name', async () => {
    const res = await coach.post('/api/variants').send({
      name: ' ',
      lift: 'snatch',
      family: '',
      bar: 'x'.repeat(41),
      equipment: ['box;bands'],
      emphasis: 'top',
      stress: { elbow: 4, spine: 1 },
      risk: 0,
      specificity: 0.555,
      scheme: 'double',
    });
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('validation_failed');
    expect(Object.keys(res.body.error.fields)).toEqual(
      expect.arrayContaining([
        'name',
        'lift',
        'family',
        'bar',
        'equipment.0',
        'emphasis',
        'stress.elbow',
        'risk',
        'specificity',
        'scheme',
      ]),
    );
  });

  it('refuses a name already in the library, whatever its case', async () => {
    const res = await coach.post('/api/variants').send(valid(`floor PRESS ${tag}`));
    expect(res.status).toBe(422);
    expect(res.body.error.fields.name[0]).toMatch(/already has this name/);
  });

  it('lets another team use the same name', async () => {
    const res = await otherCoach.post('/api/variants').send(valid(`Floor press ${tag}`));
    expect(res.status).toBe(201);
  });
});

describe('GET/PATCH/DELETE /api/variants/:id', () => {
  it('answers 404 for another team’s variant, on every method', async () => {
    const mine = (await coach.get('/api/variants?lift=deadlift')).body.items[0];
    expect((await otherCoach.get(`/api/variants/${mine.id}`)).status).toBe(404);
    expect((await otherCoach.patch(`/api/variants/${mine.id}`).send({ risk: 1, version: 1 })).status).toBe(404);
    expect((await otherCoach.delete(`/api/variants/${mine.id}`)).status).toBe(404);
    expect((await coach.get(`/api/variants/${mine.id}`)).body.risk).toBe(3);
  });

  it('answers a malformed id with a field error', async () => {
    const res = await coach.get('/api/variants/abc');
    expect(res.status).toBe(422);
    expect(res.body.error.fields).toHaveProperty('params.id');
  });

  it('edits with the version read, and refuses a stale version with the current row', async () => {
    const created = (await coach.post('/api/variants').send(valid(`Pin press ${tag}`))).body;
    const first = await coach.patch(`/api/variants/${created.id}`).send({ risk: 1, version: created.version });
    expect(first.status).toBe(200);
    expect(first.body).toMatchObject({ risk: 1, version: created.version + 1, family: 'board press' });

    const stale = await coach.patch(`/api/variants/${created.id}`).send({ risk: 3, version: created.version });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('version_conflict');
    expect(stale.body.error.current).toMatchObject({ id: created.id, risk: 1, version: created.version + 1 });
    expect((await coach.get(`/api/variants/${created.id}`)).body.risk).toBe(1);
  });

  it('refuses a rename onto another variant’s name', async () => {
    const created = (await coach.post('/api/variants').send(valid(`Close-grip ${tag}`))).body;
    const res = await coach
      .patch(`/api/variants/${created.id}`)
      .send({ name: `Rack pull ${tag}`, version: created.version });
    expect(res.status).toBe(422);
    expect(res.body.error.fields).toHaveProperty('name');
  });

  it('needs a version to edit', async () => {
    const created = (await coach.post('/api/variants').send(valid(`Spoto ${tag}`))).body;
    const res = await coach.patch(`/api/variants/${created.id}`).send({ risk: 1 });
    expect(res.status).toBe(422);
    expect(res.body.error.fields).toHaveProperty('version');
  });

  it('deletes a variant that no history uses', async () => {
    const created = (await coach.post('/api/variants').send(valid(`Throwaway ${tag}`))).body;
    const res = await coach.delete(`/api/variants/${created.id}`);
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ result: 'deleted' });
    expect((await coach.get(`/api/variants/${created.id}`)).status).toBe(404);
  });

  it('archives a variant a plan entry uses: hidden from the list, still in the history', async () => {
    const db = t.ctx.database.db;
    const id = await createVariant(db, team.teamId, { name: `Planned once ${tag}` });
    await createPlanEntry(db, team.teamId, team.athleteId, id, { week: '2026-W05' });
    const res = await coach.delete(`/api/variants/${id}`);
    expect(res.status).toBe(200);
    expect(res.body.result).toBe('archived');
    expect(res.body.item).toMatchObject({ id, archived: true, inHistory: true });
    expect(names(await coach.get('/api/variants'))).not.toContain(`Planned once ${tag}`);
    expect(names(await coach.get('/api/variants?includeArchived=true'))).toContain(`Planned once ${tag}`);
    const history = await coach.get(`/api/athletes/${team.athleteId}/history`);
    expect(history.body.picks).toContainEqual(
      expect.objectContaining({ variantId: id, variantName: `Planned once ${tag}`, variantArchived: true }),
    );
  });

  it('archives a variant a top set uses, and restores it through PATCH', async () => {
    const db = t.ctx.database.db;
    const id = await createVariant(db, team.teamId, { name: `Lifted once ${tag}` });
    await createTopSet(db, team.teamId, team.athleteId, id, { weightKg: 140, reps: 3 });
    const archived = await coach.delete(`/api/variants/${id}`);
    expect(archived.body.result).toBe('archived');
    const again = await coach.delete(`/api/variants/${id}`);
    expect(again.body.result).toBe('archived');
    const restored = await coach
      .patch(`/api/variants/${id}`)
      .send({ archived: false, version: again.body.item.version });
    expect(restored.status).toBe(200);
    expect(restored.body.archived).toBe(false);
    expect(names(await coach.get('/api/variants'))).toContain(`Lifted once ${tag}`);
  });
});

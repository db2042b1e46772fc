// The accessory library's CSV: export, then an all-or-nothing import that adds new names, updates known
// ones, and refuses the whole file for one bad row with that row's problem.
import { beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { ACCESSORY_CSV_COLUMNS, type LibraryAccessory } from '../../shared/schemas';
import { useTestApp } from '../support/app';
import { createTeam } from '../support/factories';

const t = useTestApp();
let coach: request.Agent;
let other: request.Agent;

beforeAll(async () => {
  const db = t.ctx.database.db;
  const team = await createTeam(db);
  const otherTeam = await createTeam(db);
  coach = await t.signIn(team.coach.email);
  other = await t.signIn(otherTeam.headCoach.email);
  await coach.post('/api/accessories').send({
    name: 'Seal row',
    category: 'upperBack',
    stress: {},
    sets: 4,
    reps: 10,
    loadKg: null,
    rpe: 8,
    notes: null,
  });
});

const header = ACCESSORY_CSV_COLUMNS.join(',');
const send = (agent: request.Agent, text: string) =>
  agent
    .post('/api/accessories/import')
    .attach('file', Buffer.from(text, 'utf8'), { filename: 'a.csv', contentType: 'text/csv' });
const names = async (agent: request.Agent) =>
  ((await agent.get('/api/accessories?includeArchived=true')).body.items as LibraryAccessory[]).map((a) => a.name);

describe('accessory CSV', () => {
  it('exports the team’s library with our columns', async () => {
    const res = await coach.get('/api/accessories/export');
    expect(res.status).toBe(200);
    expect(res.headers['content-disposition']).toMatch(/rackturn-accessories-.*\.csv/);
    const [head, row] = res.text.split('\r\n');
    expect(head).toBe(header);
    expect(row).toBe('Seal row,upperBack,4,10,,8,0,0,0,0,0,0,,no');
    expect((await other.get('/api/accessories/export')).text.trim()).toBe(header);
  });

  it('refuses the whole file for one bad row, naming the row and its problem, and imports nothing', async () => {
    const text = [
      header,
      'Band pull-apart,Upper back,3,25,,,1,0,0,0,0,0,,no',
      'Nordic curl,hamstrings,0,5,,,0,0,0,0,0,2,,no',
    ].join('\r\n');
    const res = await send(coach, text);
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('invalid_rows');
    expect(res.body.error.rows).toEqual([{ row: 3, field: 'sets', message: 'At least 1 set' }]);
    expect(await names(coach)).toEqual(['Seal row']);
  });

  it('adds new names, updates known ones (archived column included) in one go', async () => {
    const text = [
      header,
      'Seal row,upperBack,5,8,,8.5,0,0,0,0,0,0,chest on the bench,no',
      'Band pull-apart,upper-back,3,25,,,1,0,0,0,0,0,,yes',
    ].join('\n');
    const res = await send(coach, text);
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ created: 1, updated: 1, unchanged: 0 });
    const items = (await coach.get('/api/accessories?includeArchived=true')).body.items as LibraryAccessory[];
    expect(items.find((a) => a.name === 'Seal row')).toMatchObject({
      sets: 5,
      reps: 8,
      rpe: 8.5,
      notes: 'chest on the bench',
    });
    expect(items.find((a) => a.name === 'Band pull-apart')).toMatchObject({
      category: 'upperBack',
      archived: true,
      stress: { shoulder: 1 },
    });
    expect(await names(other)).toEqual([]);
    // The same file again changes nothing.
    expect((await send(coach, text)).body).toEqual({ created: 0, updated: 0, unchanged: 2 });
  });
});

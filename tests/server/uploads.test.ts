// Broken uploads get a clear 400, 413 or 415 on every multipart route, never a 500: a form without a
// boundary, a body cut short, a file over the limit, a body that is not a form at all.
import { beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { weekOfDate } from '../../shared/engine/weeks';
import { useTestApp } from '../support/app';
import { createTeam, createTopSet, createVariant } from '../support/factories';

const t = useTestApp({ VIDEO_MAX_BYTES: '2048' });
let athlete: request.Agent;
let coach: request.Agent;
let topSetId: number;

beforeAll(async () => {
  const db = t.ctx.database.db;
  const team = await createTeam(db);
  const v = await createVariant(db, team.teamId);
  topSetId = await createTopSet(db, team.teamId, team.athleteId, v, { week: weekOfDate(new Date()) });
  athlete = await t.signIn(team.athleteUser.email);
  coach = await t.signIn(team.coach.email);
});

const BOUNDARY = '----rackturn-test-boundary';
/** The start of a well-formed form with one file part, without its closing boundary. */
const cutShort = (field: string, filename: string) =>
  `--${BOUNDARY}\r\nContent-Disposition: form-data; name="${field}"; filename="${filename}"\r\n` +
  `Content-Type: application/octet-stream\r\n\r\nsquat,bench,deadlift\r\n`;

const routes = [
  { name: 'video upload', agent: () => athlete, path: () => `/api/top-sets/${topSetId}/video`, field: 'video' },
  { name: 'library import', agent: () => coach, path: () => '/api/variants/import', field: 'file' },
];

describe.each(routes)('$name', ({ agent, path, field }) => {
  it('answers a form without a boundary with 400 and a clear message', async () => {
    const res = await agent().post(path()).set('Content-Type', 'multipart/form-data').send('--x\r\n\r\nabc');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_upload');
    expect(res.body.error.message).toMatch(/could not be read/);
  });

  it('answers a body cut short with 400 and a clear message', async () => {
    const res = await agent()
      .post(path())
      .set('Content-Type', `multipart/form-data; boundary=${BOUNDARY}`)
      .send(cutShort(field, 'clip.mp4'));
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('upload_incomplete');
    expect(res.body.error.message).toMatch(/ended before/);
  });

  it('answers a body that is not a form with 415', async () => {
    const res = await agent().post(path()).set('Content-Type', 'application/json').send({ file: 'x' });
    expect(res.status).toBe(415);
    expect(res.body.error.code).toBe('unsupported_media_type');
    expect(res.body.error.message).toMatch(/multipart\/form-data/);
  });

  it('answers a file over the limit with 413', async () => {
    const big = Buffer.alloc(field === 'video' ? 4096 : 5 * 1024 * 1024 + 1, 'a');
    const res = await agent().post(path()).attach(field, big, 'big.bin');
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('file_too_large');
    expect(res.body.error.message).toMatch(/limit/);
  });

  it('answers too many files with 422 naming the field', async () => {
    const res = await agent()
      .post(path())
      .attach(field, Buffer.from('a'), 'a.bin')
      .attach(field, Buffer.from('b'), 'b.bin');
    expect(res.status).toBe(422);
    expect(res.body.error.fields[field]).toBeDefined();
  });
});

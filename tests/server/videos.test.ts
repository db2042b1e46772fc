// Top-set videos: the type is read from the content (MP4, MOV, WebM only), the size limit holds, the
// object lands in the S3 stand-in, playback streams byte ranges, and only the athlete shown and the
// team's coaches can reach a video.
import { beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { weekOfDate } from '../../shared/engine/weeks';
import { videos } from '../../server/db/schema';
import { eq } from 'drizzle-orm';
import { useTestApp } from '../support/app';
import {
  createAthlete,
  createTeam,
  createTopSet,
  createUser,
  createVariant,
  type TestTeam,
} from '../support/factories';
import { athletes } from '../../server/db/schema';

// A 2 kB limit, so "too large" needs no large file.
const LIMIT = 2048;
const t = useTestApp({ VIDEO_MAX_BYTES: String(LIMIT) });
let team: TestTeam;
let other: TestTeam;
let athlete: request.Agent;
let topSetId: number;

const u32 = (n: number) => {
  const b = Buffer.alloc(4);
  b.writeUInt32BE(n);
  return b;
};
const box = (type: string, body: Buffer) => Buffer.concat([u32(8 + body.length), Buffer.from(type, 'latin1'), body]);
/** The smallest ISO BMFF file that reads as MP4: an ftyp box with the isom brand, then a media box. */
function tinyMp4(payload = 600): Buffer {
  const ftyp = box('ftyp', Buffer.concat([Buffer.from('isom'), u32(512), Buffer.from('isomiso2mp41')]));
  const mdat = box('mdat', Buffer.from(Array.from({ length: payload }, (_, i) => i % 251)));
  return Buffer.concat([ftyp, mdat]);
}
const tinyMov = () =>
  Buffer.concat([
    box('ftyp', Buffer.concat([Buffer.from('qt  '), u32(0), Buffer.from('qt  ')])),
    box('mdat', Buffer.alloc(100)),
  ]);
const tinyWebm = () => {
  const docType = Buffer.from([0x42, 0x82, 0x84, ...Buffer.from('webm')]);
  return Buffer.concat([Buffer.from([0x1a, 0x45, 0xdf, 0xa3, 0x80 | docType.length]), docType, Buffer.alloc(64)]);
};
const PNG = Buffer.from('89504e470d0a1a0a0000000d4948445200000001000000010806000000', 'hex');

beforeAll(async () => {
  const db = t.ctx.database.db;
  team = await createTeam(db);
  other = await createTeam(db);
  const v = await createVariant(db, team.teamId);
  topSetId = await createTopSet(db, team.teamId, team.athleteId, v, { week: weekOfDate(new Date()) });
  athlete = await t.signIn(team.athleteUser.email);
});

describe('POST /api/top-sets/:id/video', () => {
  let videoId: number;
  const mp4 = tinyMp4();

  it('stores an MP4 named anything, attached to the top set', async () => {
    const res = await athlete.post(`/api/top-sets/${topSetId}/video`).attach('video', mp4, 'clip.bin');
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ contentType: 'video/mp4', sizeBytes: mp4.length, originalName: 'clip.bin' });
    expect(res.body.topSet.id).toBe(topSetId);
    expect(res.body.url).toBe(`/api/videos/${res.body.id}/content`);
    videoId = res.body.id;
  });

  it('plays it back whole and by byte range', async () => {
    const whole = await athlete.get(`/api/videos/${videoId}/content`).buffer(true).parse(binary);
    expect(whole.status).toBe(200);
    expect(whole.headers['accept-ranges']).toBe('bytes');
    expect(Buffer.compare(whole.body as Buffer, mp4)).toBe(0);
    const part = await athlete
      .get(`/api/videos/${videoId}/content`)
      .set('Range', 'bytes=8-15')
      .buffer(true)
      .parse(binary);
    expect(part.status).toBe(206);
    expect(part.headers['content-range']).toBe(`bytes 8-15/${mp4.length}`);
    expect((part.body as Buffer).toString('latin1')).toBe(mp4.subarray(8, 16).toString('latin1'));
    const past = await athlete.get(`/api/videos/${videoId}/content`).set('Range', `bytes=${mp4.length}-`);
    expect(past.status).toBe(416);
  });

  it('accepts MOV and WebM, and a new upload replaces the old video', async () => {
    const mov = await athlete.post(`/api/top-sets/${topSetId}/video`).attach('video', tinyMov(), 'a.mov');
    expect(mov.body.contentType).toBe('video/quicktime');
    const webm = await athlete.post(`/api/top-sets/${topSetId}/video`).attach('video', tinyWebm(), 'a.webm');
    expect(webm.body.contentType).toBe('video/webm');
    expect((await athlete.get(`/api/videos/${videoId}`)).status).toBe(404);
    const rows = await t.ctx.database.db.select().from(videos).where(eq(videos.athleteId, team.athleteId));
    expect(rows).toHaveLength(1);
    videoId = webm.body.id;
  });

  it('refuses a file that is not MP4, MOV or WebM whatever its name, with a clear message', async () => {
    const png = await athlete
      .post(`/api/top-sets/${topSetId}/video`)
      .attach('video', PNG, { filename: 'lift.mp4', contentType: 'video/mp4' });
    expect(png.status).toBe(415);
    expect(png.body.error).toEqual({
      code: 'unsupported_type',
      message: 'Only MP4, MOV or WebM videos can be uploaded; this file is image/png.',
    });
    const text = await athlete
      .post(`/api/top-sets/${topSetId}/video`)
      .attach('video', Buffer.from('not a video at all'), 'x.webm');
    expect(text.status).toBe(415);
    expect(text.body.error.message).toMatch(/not a video we can read/);
  });

  it('refuses a file over the size limit with the limit in the message', async () => {
    const res = await athlete.post(`/api/top-sets/${topSetId}/video`).attach('video', tinyMp4(LIMIT + 1), 'big.mp4');
    expect(res.status).toBe(413);
    expect(res.body.error).toEqual({
      code: 'file_too_large',
      message: 'That video is larger than the 2 kB limit. Trim it to the top set and try again.',
    });
  });

  it('asks for the file when none is sent', async () => {
    const res = await athlete.post(`/api/top-sets/${topSetId}/video`).field('note', 'x');
    expect(res.status).toBe(422);
    expect(res.body.error.fields.video).toEqual(['Choose a video file']);
  });

  it("answers 404 for another athlete's top set", async () => {
    const db = t.ctx.database.db;
    const mate = await createAthlete(db, team.teamId);
    const v = await createVariant(db, team.teamId);
    const mateSet = await createTopSet(db, team.teamId, mate, v);
    const res = await athlete.post(`/api/top-sets/${mateSet}/video`).attach('video', tinyMp4(), 'a.mp4');
    expect(res.status).toBe(404);
  });

  it('shows the video to the team’s coaches, who comment on it, and the athlete reads the comments', async () => {
    const coach = await t.signIn(team.coach.email);
    expect((await coach.get(`/api/videos/${videoId}/content`)).status).toBe(200);
    const bad = await coach.post(`/api/videos/${videoId}/comments`).send({ body: '   ' });
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields.body).toEqual(['Write a comment']);
    const ok = await coach.post(`/api/videos/${videoId}/comments`).send({ body: 'Hips rose first; brace harder.' });
    expect(ok.status).toBe(201);
    expect(ok.body.comments).toEqual([expect.objectContaining({ body: 'Hips rose first; brace harder.' })]);
    const seen = await athlete.get(`/api/videos/${videoId}`);
    expect(seen.body.comments[0].authorName).toMatch(/Test coach/);
    expect((await athlete.post(`/api/videos/${videoId}/comments`).send({ body: 'x' })).status).toBe(403);
    const history = await athlete.get('/api/my-history');
    expect(history.body.videos[0]).toMatchObject({
      id: videoId,
      comments: [expect.objectContaining({ body: 'Hips rose first; brace harder.' })],
    });
    const review = await coach.get(`/api/athletes/${team.athleteId}/review`);
    expect(review.body.videos[0]).toMatchObject({
      id: videoId,
      comments: [expect.objectContaining({ body: expect.any(String) })],
    });
  });

  it('hides the video from another athlete of the same team and from another team', async () => {
    const db = t.ctx.database.db;
    const mateUser = await createUser(db, team.teamId, 'athlete');
    await db
      .insert(athletes)
      .values({ teamId: team.teamId, userId: mateUser.id, name: 'Mate', sex: 'M', equipment: [], ruleOverrides: {} });
    const mate = await t.signIn(mateUser.email);
    const stranger = await t.signIn(other.headCoach.email);
    for (const agent of [mate, stranger]) {
      expect((await agent.get(`/api/videos/${videoId}`)).status).toBe(404);
      expect((await agent.get(`/api/videos/${videoId}/content`)).status).toBe(404);
    }
    expect((await stranger.post(`/api/videos/${videoId}/comments`).send({ body: 'Nice' })).status).toBe(404);
    expect((await stranger.get(`/api/athletes/${team.athleteId}/review`)).status).toBe(404);
  });
});

/** Collects a response body as bytes (supertest would otherwise try to read video as text). */
const binary = ((res: NodeJS.ReadableStream, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
}) as unknown as Parameters<request.Test['parse']>[0];

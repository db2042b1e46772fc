// Videos of top sets: checked by content, stored in object storage, shown only to the athlete who
// lifted and the team's coaches, with the coaches' comments.
import { inTransaction } from '../../db/transaction';
import { randomUUID } from 'node:crypto';
import { createReadStream } from 'node:fs';
import { fileTypeFromFile } from 'file-type';
import { VIDEO_TYPES, type Video } from '../../../shared/schemas';
import type { AppContext } from '../../context';
import type { AuthContext } from '../../middleware/auth';
import type { Queryable } from '../../db/client';
import { AppError, NotFoundError } from '../../lib/errors';
import { noticeVideo } from '../notices/notices.service';
import { findTopSet, setTopSetVideo, topSetsByVideo } from '../top-sets/top-sets.service';
import {
  deleteVideo,
  findVideo,
  insertComment,
  insertVideo,
  listAthleteVideos,
  listComments,
  type VideoRow,
} from './videos.repository';

type VideoExt = keyof typeof VIDEO_TYPES;

/** The container of a file, from its first bytes; null for anything but MP4, MOV or WebM. */
export async function detectVideoType(path: string): Promise<{ ext: VideoExt; mime: string } | null> {
  const found = await fileTypeFromFile(path);
  if (!found || !(found.ext in VIDEO_TYPES)) return null;
  const ext = found.ext as VideoExt;
  return { ext, mime: VIDEO_TYPES[ext] };
}

export class UnsupportedVideoError extends AppError {
  constructor(detected: string | undefined) {
    super(
      415,
      'unsupported_type',
      `Only MP4, MOV or WebM videos can be uploaded${detected ? `; this file is ${detected}` : '; this file is not a video we can read'}.`,
    );
  }
}

/** A video is seen by the team's coaches and by the athlete it shows; for anyone else it does not exist. */
export async function visibleVideo(db: Queryable, auth: AuthContext, id: number): Promise<VideoRow> {
  const video = await findVideo(db, auth.teamId, id);
  if (!video || (auth.role === 'athlete' && video.athleteId !== auth.athleteId)) throw new NotFoundError('That video');
  return video;
}

export function contentUrl(id: number): string {
  return `/api/videos/${id}/content`;
}

/** Videos with their top sets and comments, in the order given. */
export async function describeVideos(
  db: Queryable,
  teamId: number,
  athleteId: number,
  rows: VideoRow[],
): Promise<Video[]> {
  const ids = rows.map((v) => v.id);
  const [sets, comments] = await Promise.all([
    topSetsByVideo(db, teamId, athleteId, ids),
    listComments(db, teamId, ids),
  ]);
  return rows.map((v) => ({
    id: v.id,
    athleteId: v.athleteId,
    contentType: v.contentType,
    sizeBytes: Number(v.sizeBytes),
    originalName: v.originalName,
    createdAt: v.createdAt.toISOString(),
    url: contentUrl(v.id),
    topSet: sets.get(v.id) ?? null,
    comments: comments
      .filter((c) => c.videoId === v.id)
      .map((c) => ({ id: c.id, body: c.body, authorName: c.authorName, createdAt: c.createdAt.toISOString() })),
  }));
}

export async function athleteVideos(db: Queryable, teamId: number, athleteId: number, limit = 20) {
  return describeVideos(db, teamId, athleteId, await listAthleteVideos(db, teamId, athleteId, limit));
}

/**
 * Stores an uploaded file as the video of one of the athlete's top sets, replacing any earlier one
 * (its comments go with it). The object is written before the rows, and removed again if they fail.
 */
export async function attachVideo(
  ctx: Pick<AppContext, 'database' | 'services' | 'logger'>,
  who: { teamId: number; athleteId: number; userId: number },
  topSetId: number,
  file: { path: string; size: number; originalname: string },
): Promise<Video> {
  const db = ctx.database.db;
  const { teamId, athleteId } = who;
  const topSet = await findTopSet(db, teamId, athleteId, topSetId);
  if (!topSet) throw new NotFoundError('That top set');
  const type = await detectVideoType(file.path);
  if (!type) {
    const found = await fileTypeFromFile(file.path);
    throw new UnsupportedVideoError(found ? `${found.mime}` : undefined);
  }
  const key = `videos/team-${teamId}/athlete-${athleteId}/${randomUUID()}.${type.ext}`;
  await ctx.services.storage.put(key, createReadStream(file.path), { length: file.size, contentType: type.mime });
  let replaced: VideoRow | null = null;
  let videoId: number;
  try {
    videoId = await inTransaction(db, async (tx) => {
      replaced = topSet.videoId ? await findVideo(tx, teamId, topSet.videoId) : null;
      const id = await insertVideo(tx, {
        teamId,
        athleteId,
        storageKey: key,
        contentType: type.mime,
        sizeBytes: file.size,
        originalName: file.originalname.slice(0, 255) || null,
        uploadedBy: who.userId,
      });
      await setTopSetVideo(tx, teamId, topSet.id, id);
      if (replaced) await deleteVideo(tx, teamId, replaced.id);
      await noticeVideo(tx, { teamId, athleteId, videoId: id });
      return id;
    });
  } catch (err) {
    await ctx.services.storage.delete(key).catch(() => undefined);
    throw err;
  }
  const old = replaced as VideoRow | null;
  if (old) {
    await ctx.services.storage.delete(old.storageKey).catch((err: unknown) => {
      ctx.logger.warn({ err, key: old.storageKey }, 'could not delete a replaced video');
    });
  }
  const [video] = await describeVideos(db, teamId, athleteId, [(await findVideo(db, teamId, videoId))!]);
  return video!;
}

export async function addComment(db: Queryable, auth: AuthContext, videoId: number, body: string): Promise<Video> {
  const video = await visibleVideo(db, auth, videoId);
  await insertComment(db, { teamId: auth.teamId, videoId, authorId: auth.userId, body });
  const [described] = await describeVideos(db, auth.teamId, video.athleteId, [video]);
  return described!;
}

// /api/top-sets/:id/video (upload), /api/videos/:id (details and comments), /api/videos/:id/content
// (the video itself, streamed with byte ranges) and /api/videos/:id/comments (coaches).
import { Router, type RequestHandler } from 'express';
import { unlink } from 'node:fs/promises';
import { pipeline } from 'node:stream/promises';
import { VIDEO_FIELD, idParams, videoCommentBody } from '../../../shared/schemas';
import type { AppContext } from '../../context';
import { ANY_ROLE, ATHLETE, STAFF, authOf, requireRole } from '../../middleware/auth';
import { receiveFile, megabytes } from '../../middleware/upload';
import { validate } from '../../middleware/validate';
import { AppError, ValidationError } from '../../lib/errors';
import { ownAthleteId } from '../../lib/scope';
import { parseRange } from './range';
import { addComment, attachVideo, describeVideos, visibleVideo } from './videos.service';

/** Receives one file in the `video` field into a temporary file, refusing anything over the limit. */
function receiveVideo(ctx: AppContext): RequestHandler {
  return receiveFile({
    field: VIDEO_FIELD,
    maxBytes: ctx.env.VIDEO_MAX_BYTES,
    storage: 'disk',
    tooLarge: `That video is larger than the ${megabytes(ctx.env.VIDEO_MAX_BYTES)} limit. Trim it to the top set and try again.`,
    oneFile: 'Send one video file',
  });
}

export function videosRouter(ctx: AppContext): Router {
  const router = Router();
  const db = ctx.database.db;

  router.post(
    '/top-sets/:id/video',
    requireRole(ATHLETE),
    receiveVideo(ctx),
    validate({ params: idParams }, async ({ params }, req, res) => {
      const file = req.file;
      if (!file) throw new ValidationError('Some fields need attention.', { [VIDEO_FIELD]: ['Choose a video file'] });
      try {
        const auth = authOf(req);
        const video = await attachVideo(
          ctx,
          { teamId: auth.teamId, athleteId: ownAthleteId(req), userId: auth.userId },
          params.id,
          file,
        );
        res.status(201);
        return video;
      } finally {
        await unlink(file.path).catch(() => undefined);
      }
    }),
  );

  router.get(
    '/videos/:id',
    requireRole(ANY_ROLE),
    validate({ params: idParams }, async ({ params }, req) => {
      const video = await visibleVideo(db, authOf(req), params.id);
      const [described] = await describeVideos(db, video.teamId, video.athleteId, [video]);
      return described;
    }),
  );

  router.get(
    '/videos/:id/content',
    requireRole(ANY_ROLE),
    validate({ params: idParams }, async ({ params }, req, res) => {
      const video = await visibleVideo(db, authOf(req), params.id);
      const size = Number(video.sizeBytes);
      const range = parseRange(req.get('range'), size);
      res.setHeader('Accept-Ranges', 'bytes');
      if (range === 'unsatisfiable') {
        res.setHeader('Content-Range', `bytes */${size}`);
        throw new AppError(416, 'range_not_satisfiable', 'That part of the video does not exist.');
      }
      const object = await ctx.services.storage.get(video.storageKey, range ?? undefined);
      res.status(range ? 206 : 200);
      res.setHeader('Content-Type', video.contentType);
      res.setHeader('Content-Length', String(range ? range.end - range.start + 1 : size));
      if (range) res.setHeader('Content-Range', `bytes ${range.start}-${range.end}/${size}`);
      try {
        await pipeline(object.body, res);
      } catch (err) {
        // A player that seeks closes the old request half-way: not an error worth a log line.
        if ((err as { code?: string }).code !== 'ERR_STREAM_PREMATURE_CLOSE') throw err;
      }
      return undefined;
    }),
  );

  router.post(
    '/videos/:id/comments',
    requireRole(STAFF),
    validate({ params: idParams, body: videoCommentBody }, async ({ params, body }, req, res) => {
      const video = await addComment(db, authOf(req), params.id, body.body);
      res.status(201);
      return video;
    }),
  );

  return router;
}

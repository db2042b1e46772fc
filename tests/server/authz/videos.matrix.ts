// Authorization entries for top-set videos: upload (the athlete), details and the stream (the athlete
// shown and the team's coaches), comments (coaches).
import { loadEnv } from '../../../server/config/env';
import { videos } from '../../../server/db/schema';
import { createStorage } from '../../../server/services/storage';
import { createTopSet, createVariant, uniq } from '../../support/factories';
import { athleteOnly, signedIn, staff, type MatrixModule } from './types';

export const matrix: MatrixModule = {
  async setup(db, team) {
    const variantId = await createVariant(db, team.teamId);
    const topSetId = await createTopSet(db, team.teamId, team.athleteId, variantId);
    const key = `videos/matrix/${uniq()}.webm`;
    const body = Buffer.from([0x1a, 0x45, 0xdf, 0xa3, 0x42, 0x82, 0x84, 0x77, 0x65, 0x62, 0x6d]);
    const storage = createStorage(
      loadEnv({ ...process.env, DATABASE_URL: 'mysql://unused', SESSION_SECRET: 'x'.repeat(32) }),
    );
    await storage.put(key, body, { length: body.length, contentType: 'video/webm' });
    storage.close();
    const [v] = await db
      .insert(videos)
      .values({
        teamId: team.teamId,
        athleteId: team.athleteId,
        storageKey: key,
        contentType: 'video/webm',
        sizeBytes: body.length,
      })
      .$returningId();
    return { matrixTopSet: topSetId, matrixVideo: v!.id };
  },
  cases: {
    'POST /api/top-sets/:id/video': {
      path: (f) => `/api/top-sets/${f.ids.matrixTopSet}/video`,
      // A JSON body where a form with a file belongs: the wrong media type.
      invalidBody: {},
      expect: athleteOnly(415),
    },
    'GET /api/videos/:id': { path: (f) => `/api/videos/${f.ids.matrixVideo}`, expect: signedIn(200, 404) },
    'GET /api/videos/:id/content': {
      path: (f) => `/api/videos/${f.ids.matrixVideo}/content`,
      expect: signedIn(200, 404),
    },
    'POST /api/videos/:id/comments': {
      path: (f) => `/api/videos/${f.ids.matrixVideo}/comments`,
      invalidBody: {},
      validBody: () => ({ body: 'Looks solid.' }),
      expect: staff(422),
    },
  },
};

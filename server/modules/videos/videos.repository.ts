// SQL for uploaded videos and the coaches' comments on them, scoped to the team.
import { and, asc, desc, eq, inArray } from 'drizzle-orm';
import type { Queryable } from '../../db/client';
import { users, videoComments, videos } from '../../db/schema';

export async function insertVideo(db: Queryable, row: typeof videos.$inferInsert): Promise<number> {
  const [res] = await db.insert(videos).values(row).$returningId();
  return res!.id;
}

export async function findVideo(db: Queryable, teamId: number, id: number) {
  const [row] = await db
    .select()
    .from(videos)
    .where(and(eq(videos.teamId, teamId), eq(videos.id, id)))
    .limit(1);
  return row ?? null;
}
export type VideoRow = NonNullable<Awaited<ReturnType<typeof findVideo>>>;

export async function deleteVideo(db: Queryable, teamId: number, id: number) {
  await db.delete(videos).where(and(eq(videos.teamId, teamId), eq(videos.id, id)));
}

export async function listAthleteVideos(db: Queryable, teamId: number, athleteId: number, limit: number) {
  return db
    .select()
    .from(videos)
    .where(and(eq(videos.teamId, teamId), eq(videos.athleteId, athleteId)))
    .orderBy(desc(videos.createdAt), desc(videos.id))
    .limit(limit);
}

export async function listComments(db: Queryable, teamId: number, videoIds: number[]) {
  if (videoIds.length === 0) return [];
  return db
    .select({
      id: videoComments.id,
      videoId: videoComments.videoId,
      body: videoComments.body,
      authorName: users.name,
      createdAt: videoComments.createdAt,
    })
    .from(videoComments)
    .leftJoin(users, eq(users.id, videoComments.authorId))
    .where(and(eq(videoComments.teamId, teamId), inArray(videoComments.videoId, videoIds)))
    .orderBy(asc(videoComments.createdAt), asc(videoComments.id));
}

export async function insertComment(db: Queryable, row: typeof videoComments.$inferInsert): Promise<number> {
  const [res] = await db.insert(videoComments).values(row).$returningId();
  return res!.id;
}

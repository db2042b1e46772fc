// Notices for coaches: pain in a check-in, a much lower or missed top set, a new video and a new message
// from an athlete each make one notice per coach of the team; a daily e-mail summary per coach.
import { addWeeks, weekOfDate } from '../../../shared/engine/weeks';
import type { Notice, NoticeList, NoticeSettings } from '../../../shared/schemas';
import type { AppContext } from '../../context';
import type { Queryable } from '../../db/client';
import { inTransaction } from '../../db/transaction';
import { NotFoundError } from '../../lib/errors';
import { appLink } from '../../lib/link-tokens';
import { publishChange } from '../events/events.service';
import { readRulesOfTeam } from '../tissue/tissue.service';
import { noticeDigestMail, signDigestToken } from './digest';
import {
  athleteName,
  coachesDueDigest,
  digestNotices,
  findNotice,
  findSettings,
  findUser,
  insertNotices,
  listNotices,
  markDigested,
  markNoticesRead,
  saveDailyEmail,
  setLastDigestOn,
  teamCoachIds,
  unloggedEntries,
  type NewNotice,
} from './notices.repository';

/**
 * A top set counts as much lower when its e1RM is under 90 % of the athlete's best e1RM on the same
 * variant. Common coaching practice, no published source (from memory): a drop of about a tenth from a
 * recent best is more than day-to-day variation and worth a coach's look.
 */
export const MUCH_LOWER_RATIO = 0.9;

export function isMuchLower(e1rmKg: number, bestE1rmKg: number | null): boolean {
  return bestE1rmKg !== null && bestE1rmKg > 0 && e1rmKg < bestE1rmKg * MUCH_LOWER_RATIO;
}

/** The hour (UTC) from which the day's summary goes out. */
export const DIGEST_HOUR_UTC = 6;

const athletePath = (athleteId: number) => `/athletes/${athleteId}`;

async function notifyCoaches(db: Queryable, n: NewNotice) {
  await insertNotices(db, await teamCoachIds(db, n.teamId), n);
  await publishChange(db, { teamId: n.teamId, athleteId: null, topic: 'notices' });
}

async function nameOf(db: Queryable, teamId: number, athleteId: number) {
  return (await athleteName(db, teamId, athleteId)) ?? 'An athlete';
}

/** A check-in that names painful joints. */
export async function noticePain(
  db: Queryable,
  c: { teamId: number; athleteId: number; week: string; checkinId: number; joints: string[] },
) {
  if (c.joints.length === 0) return;
  const words = c.joints.map((j) => (j === 'lowerBack' ? 'lower back' : j)).join(', ');
  await notifyCoaches(db, {
    teamId: c.teamId,
    kind: 'pain',
    athleteId: c.athleteId,
    week: c.week,
    text: `${await nameOf(db, c.teamId, c.athleteId)} reported pain (${words}) in the ${c.week} check-in`,
    path: athletePath(c.athleteId),
    dedupeKey: `pain:${c.checkinId}`,
  });
}

/** A top set well under the athlete's best on that variant. */
export async function noticeTopSet(
  db: Queryable,
  s: {
    teamId: number;
    athleteId: number;
    week: string;
    topSetId: number;
    variantName: string;
    e1rmKg: number;
    bestE1rmKg: number | null;
  },
) {
  if (!isMuchLower(s.e1rmKg, s.bestE1rmKg)) return;
  const pct = Math.round((1 - s.e1rmKg / s.bestE1rmKg!) * 100);
  await notifyCoaches(db, {
    teamId: s.teamId,
    kind: 'top_set_low',
    athleteId: s.athleteId,
    week: s.week,
    text: `${await nameOf(db, s.teamId, s.athleteId)}: ${s.variantName} top set ${pct} % under the best e1RM`,
    path: athletePath(s.athleteId),
    dedupeKey: `low:${s.topSetId}`,
  });
}

export async function noticeVideo(db: Queryable, v: { teamId: number; athleteId: number; videoId: number }) {
  await notifyCoaches(db, {
    teamId: v.teamId,
    kind: 'video',
    athleteId: v.athleteId,
    week: weekOfDate(new Date()),
    text: `${await nameOf(db, v.teamId, v.athleteId)} uploaded a top-set video`,
    path: athletePath(v.athleteId),
    dedupeKey: `video:${v.videoId}`,
  });
}

export async function noticeMessage(
  db: Queryable,
  m: { teamId: number; athleteId: number; week: string; messageId: number; body: string },
) {
  const excerpt = m.body.length > 80 ? `${m.body.slice(0, 79)}…` : m.body;
  await notifyCoaches(db, {
    teamId: m.teamId,
    kind: 'message',
    athleteId: m.athleteId,
    week: m.week,
    text: `${await nameOf(db, m.teamId, m.athleteId)} wrote (${m.week}): “${excerpt}”`,
    path: athletePath(m.athleteId),
    dedupeKey: `message:${m.messageId}`,
  });
}

/** Once a week is over: a notice for each published pick with no top set logged. Safe to run again. */
export async function noticeMissedTopSets(ctx: Pick<AppContext, 'database'>, now = new Date()): Promise<number> {
  const db = ctx.database.db;
  const week = addWeeks(weekOfDate(now), -1);
  const rows = await unloggedEntries(db, week);
  // Slots are named in each team's rules; read once per team.
  const slotsOf = new Map<number, { id: string; label: string }[]>();
  for (const r of rows) {
    if (!slotsOf.has(r.teamId)) slotsOf.set(r.teamId, (await readRulesOfTeam(db, r.teamId)).slots);
    const slot = slotsOf.get(r.teamId)!.find((s) => s.id === r.slotId)?.label ?? r.slotId;
    await notifyCoaches(db, {
      teamId: r.teamId,
      kind: 'top_set_missed',
      athleteId: r.athleteId,
      week,
      text: `${r.athleteName} logged no top set for ${slot} (${r.variantName}) in ${week}`,
      path: athletePath(r.athleteId),
      dedupeKey: `missed:${r.entryId}`,
    });
  }
  return rows.length;
}

export async function noticesFor(
  ctx: Pick<AppContext, 'database'>,
  who: { teamId: number; userId: number },
  q: { limit: number; offset: number },
): Promise<NoticeList> {
  const { rows, total, unread } = await listNotices(ctx.database.db, who.teamId, who.userId, q);
  const items: Notice[] = rows.map((r) => ({
    id: r.id,
    kind: r.kind,
    athleteId: r.athleteId,
    week: r.week,
    text: r.text,
    path: r.path,
    read: r.readAt !== null,
    createdAt: r.createdAt.toISOString(),
  }));
  return { items, total, unread };
}

export async function readNotice(
  ctx: Pick<AppContext, 'database'>,
  who: { teamId: number; userId: number },
  id: number,
) {
  const db = ctx.database.db;
  if (!(await findNotice(db, who.teamId, who.userId, id))) throw new NotFoundError('That notice');
  await markNoticesRead(db, who.teamId, who.userId, [id]);
  return { read: true };
}

export async function readAllNotices(ctx: Pick<AppContext, 'database'>, who: { teamId: number; userId: number }) {
  return { marked: await markNoticesRead(ctx.database.db, who.teamId, who.userId, null) };
}

export async function settingsOf(ctx: Pick<AppContext, 'database'>, userId: number): Promise<NoticeSettings> {
  return { dailyEmail: (await findSettings(ctx.database.db, userId))?.dailyEmail ?? true };
}

export async function setDailyEmail(ctx: Pick<AppContext, 'database'>, userId: number, on: boolean) {
  await saveDailyEmail(ctx.database.db, userId, on);
  return { dailyEmail: on };
}

/**
 * Queues today's summary for every coach who has unread notices not yet summarised, from DIGEST_HOUR_UTC
 * on, once a day (the day is kept per coach, and the outbox's key is per coach and day). Returns how
 * many were queued.
 */
export async function sendNoticeDigests(
  ctx: Pick<AppContext, 'database' | 'services' | 'env'>,
  now = new Date(),
): Promise<number> {
  if (now.getUTCHours() < DIGEST_HOUR_UTC) return 0;
  const day = now.toISOString().slice(0, 10);
  const db = ctx.database.db;
  let queued = 0;
  for (const due of await coachesDueDigest(db, day, now)) {
    const user = await findUser(db, due.userId);
    if (!user) continue;
    const unsubscribeUrl = appLink(ctx.env.APP_ORIGIN, '/api/notices/daily-email/off', {
      token: await signDigestToken(ctx.env.SESSION_SECRET, user.id),
    });
    const sent = await inTransaction(db, async (tx) => {
      const rows = await digestNotices(tx, due.teamId, user.id, now);
      if (rows.length === 0) return false;
      const mail = noticeDigestMail({
        coachName: user.name,
        items: rows.map((r) => ({ text: r.text, url: appLink(ctx.env.APP_ORIGIN, r.path) })),
        appUrl: appLink(ctx.env.APP_ORIGIN, '/board'),
        unsubscribeUrl,
      });
      const fresh = await ctx.services.mail.enqueue(tx, {
        kind: 'notice_digest',
        dedupeKey: `notice-digest:${user.id}:${day}`,
        teamId: due.teamId,
        to: user.email,
        ...mail,
        headers: { 'List-Unsubscribe': `<${unsubscribeUrl}>`, 'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click' },
      });
      await setLastDigestOn(tx, user.id, day);
      if (!fresh) return false;
      await markDigested(
        tx,
        rows.map((r) => r.id),
        now,
      );
      return true;
    });
    if (sent) queued++;
  }
  if (queued) ctx.services.mail.kick();
  return queued;
}

/** The notice jobs on a timer: missed top sets and the daily summaries. Safe on several instances at once. */
export function startNoticeJobs(ctx: AppContext, intervalMs: number): { stop(): void } {
  if (intervalMs <= 0) return { stop() {} };
  const log = ctx.logger.child({ module: 'notices' });
  let running = false;
  const timer = setInterval(() => {
    if (running) return;
    running = true;
    Promise.all([noticeMissedTopSets(ctx), sendNoticeDigests(ctx)])
      .catch((err: unknown) => log.error({ err }, 'notice jobs failed'))
      .finally(() => {
        running = false;
      });
  }, intervalMs);
  timer.unref();
  return { stop: () => clearInterval(timer) };
}

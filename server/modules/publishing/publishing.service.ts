// Publishing a week moves each athlete's week from draft to published. It checks first (empty cells,
// rule breaks without a reason, athletes without an account, who would get an e-mail); the real run stores
// what each athlete was sent and, in the same transaction, queues an e-mail per athlete with something new:
// the week's picks the first time, an update naming what changed after that. Nothing changed: nothing sent.
import { publishChange } from '../events/events.service';
import type { PublishCheck, PublishResult, Publication } from '../../../shared/schemas';
import type { PublishedPick } from '../../db/schema';
import { inTransaction } from '../../db/transaction';
import { ConflictError, ValidationError } from '../../lib/errors';
import type { AppContext } from '../../context';
import type { Queryable } from '../../db/client';
import type { AuthContext } from '../../middleware/auth';
import { weeklyPlanMail, type WeeklyPick } from '../../services/mail/templates';
import { appLink, signUnsubscribeToken } from '../../lib/link-tokens';
import { today, weekForPublishing } from '../plans/review.service';
import { tissueWorkFor } from '../tissue/tissue.service';
import * as repo from './publishing.repository';

async function publicationOf(db: Queryable, teamId: number, week: string): Promise<Publication> {
  const [row, recipients, counts] = await Promise.all([
    repo.findPublication(db, teamId, week),
    repo.weeklyRecipients(db, teamId),
    repo.deliveryCounts(db, teamId, week),
  ]);
  return {
    week,
    published: Boolean(row),
    publishedAt: row?.publishedAt.toISOString() ?? null,
    publishedByName: row?.publishedByName ?? null,
    recipients: recipients.length,
    ...counts,
  };
}

export function getPublication(ctx: AppContext, teamId: number, week: string) {
  return publicationOf(ctx.database.db, teamId, week);
}

type Account = Awaited<ReturnType<typeof repo.athleteAccounts>>[number];

interface AthleteWeek {
  athleteId: number;
  athleteName: string;
  account: Account | undefined;
  picks: PublishedPick[];
  /** The publication row as it stands, if the week was published for this athlete before. */
  previous: { id: number; version: number; picks: PublishedPick[] } | null;
  /** Lines naming what changed since the last publication; empty when nothing did. */
  changes: string[];
}

const samePicks = (a: PublishedPick[], b: PublishedPick[]) =>
  a.length === b.length && a.every((p, i) => p.slotId === b[i]!.slotId && p.variantId === b[i]!.variantId);

function changeLines(before: PublishedPick[], after: PublishedPick[], slotLabel: (id: string) => string): string[] {
  const old = new Map(before.map((p) => [p.slotId, p]));
  const now = new Map(after.map((p) => [p.slotId, p]));
  const out: string[] = [];
  for (const slotId of new Set([...old.keys(), ...now.keys()])) {
    const a = old.get(slotId);
    const b = now.get(slotId);
    const label = slotLabel(slotId);
    if (a && b && a.variantId !== b.variantId) out.push(`${label}: ${b.variantName} instead of ${a.variantName}`);
    else if (!a && b) out.push(`${label}: ${b.variantName} added`);
    else if (a && !b) out.push(`${label}: ${a.variantName} taken off`);
  }
  return out;
}

function checkWeekIsOpen(week: string) {
  const t = today();
  if (week !== t.week && week !== t.next) {
    throw new ValidationError(
      `Only this week (${t.week}) or next week (${t.next}) can be published; ${week} is neither.`,
      {
        'params.week': [`Publish ${t.week} or ${t.next}`],
      },
    );
  }
}

/** The week of every athlete as it would be published, and the check the coach reads first. */
async function review(tx: Queryable, teamId: number, week: string, lock: boolean) {
  const [plan, accounts, published] = await Promise.all([
    weekForPublishing(tx, teamId, week),
    repo.athleteAccounts(tx, teamId),
    repo.athletePublications(tx, teamId, week, lock),
  ]);
  const slotLabel = (id: string) => plan.slots.find((s) => s.id === id)?.label ?? id;
  const slotOrder = new Map(plan.slots.map((s, i) => [s.id, i]));
  const accountOf = new Map(accounts.map((a) => [a.athleteId, a]));
  const previousOf = new Map(published.map((p) => [p.athleteId, p]));

  const check: PublishCheck = {
    week,
    emptyCells: { count: 0, items: [] },
    unexplainedBreaks: { count: 0, items: [] },
    withoutAccount: { count: 0, items: [] },
    wouldEmail: { count: 0, items: [] },
  };
  const weeks: AthleteWeek[] = [];
  for (const a of plan.athletes) {
    const cells = plan.cells.filter((c) => c.athleteId === a.id);
    const ref = { athleteId: a.id, athleteName: a.name };
    for (const slot of plan.slots) {
      if (!cells.some((c) => c.slotId === slot.id)) {
        check.emptyCells.items.push({ ...ref, slotId: slot.id, slotLabel: slot.label });
      }
    }
    for (const c of cells) {
      if (c.status !== 'break' || c.reason) continue;
      check.unexplainedBreaks.items.push({
        ...ref,
        slotId: c.slotId,
        slotLabel: slotLabel(c.slotId),
        variantName: plan.variantName(c.variantId),
        messages: c.reasons,
      });
    }
    const account = accountOf.get(a.id);
    if (!account?.userId || !account.member) check.withoutAccount.items.push({ ...ref, email: null });
    const picks = cells
      .map((c) => ({ slotId: c.slotId, variantId: c.variantId, variantName: plan.variantName(c.variantId) }))
      .sort((x, y) => (slotOrder.get(x.slotId) ?? 99) - (slotOrder.get(y.slotId) ?? 99));
    const prev = previousOf.get(a.id);
    const previous = prev ? { id: prev.id, version: prev.version, picks: prev.picks } : null;
    if (previous && samePicks(previous.picks, picks)) continue;
    const changes = previous ? changeLines(previous.picks, picks, slotLabel) : [];
    const week1: AthleteWeek = { ...ref, account, picks, previous, changes };
    weeks.push(week1);
    // An e-mail goes to an athlete who can open My week, wants the weekly e-mail and has something to read:
    // a week with no max-effort work at all gets no e-mail.
    if (account?.userId && account.member && account.weeklyEmail && account.email && (picks.length || previous)) {
      check.wouldEmail.items.push({ ...ref, email: account.email, kind: previous ? 'update' : 'plan', changes });
    }
  }
  for (const list of [check.emptyCells, check.unexplainedBreaks, check.withoutAccount, check.wouldEmail]) {
    list.count = list.items.length;
  }
  return { check, weeks, slotLabel };
}

/** The check alone: nothing is stored or sent. */
export async function publishCheck(ctx: AppContext, teamId: number, week: string): Promise<PublishCheck> {
  checkWeekIsOpen(week);
  return (await review(ctx.database.db, teamId, week, false)).check;
}

async function queueMail(
  ctx: AppContext,
  tx: Queryable,
  auth: AuthContext,
  week: string,
  w: AthleteWeek,
  version: number,
  slotLabel: (id: string) => string,
) {
  const account = w.account!;
  const notes = await repo.weekPicks(tx, auth.teamId, week, [w.athleteId]);
  const picks: WeeklyPick[] = w.picks.map((p) => {
    const stored = notes.find((n) => n.slotId === p.slotId);
    return {
      slotLabel: slotLabel(p.slotId),
      variantName: p.variantName,
      scheme: stored?.scheme ?? 'single',
      notes: stored?.notes ?? null,
    };
  });
  const tissue = await tissueWorkFor(tx, auth.teamId, w.athleteId, week);
  const unsubscribeUrl = appLink(ctx.env.APP_ORIGIN, '/api/email/unsubscribe', {
    token: await signUnsubscribeToken(ctx.env.SESSION_SECRET, account.userId!),
  });
  const mail = weeklyPlanMail({
    athleteName: w.athleteName,
    teamName: auth.teamName,
    week,
    picks,
    tissue: tissue.items,
    myWeekUrl: appLink(ctx.env.APP_ORIGIN, '/my-week'),
    unsubscribeUrl,
    ...(w.previous ? { changes: w.changes } : {}),
  });
  // The first e-mail of a week keeps its old key; each update has its own.
  const suffix = version > 1 ? `:${version}` : '';
  await ctx.services.mail.enqueue(tx, {
    kind: 'weekly_plan',
    dedupeKey: `${repo.weeklyDedupePrefix(auth.teamId, week)}${account.userId}${suffix}`,
    teamId: auth.teamId,
    to: account.email!,
    ...mail,
    headers: { 'List-Unsubscribe': `<${unsubscribeUrl}>`, 'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click' },
  });
}

/**
 * Publishes the week for every athlete whose week is new or changed since it was last published.
 * `created` is false when nothing was new: nothing is queued then.
 */
export async function publishWeek(
  ctx: AppContext,
  auth: AuthContext,
  week: string,
): Promise<{ created: boolean; result: PublishResult }> {
  checkWeekIsOpen(week);
  const outcome = await inTransaction(ctx.database.db, async (tx) => {
    const teamRowCreated = await repo.insertPublication(tx, auth.teamId, week, auth.userId);
    const { check, weeks, slotLabel } = await review(tx, auth.teamId, week, true);
    const mailTo = new Set(check.wouldEmail.items.map((m) => m.athleteId));
    let emailsQueued = 0;
    for (const w of weeks) {
      let version = 1;
      if (w.previous) {
        version = w.previous.version + 1;
        if (!(await repo.updateAthletePublication(tx, w.previous.id, w.previous.version, w.picks, auth.userId))) {
          throw new ConflictError('Someone else published this week just now; check again and publish.');
        }
      } else {
        await repo.insertAthletePublication(tx, {
          teamId: auth.teamId,
          athleteId: w.athleteId,
          week,
          picks: w.picks,
          publishedBy: auth.userId,
        });
      }
      await publishChange(tx, { teamId: auth.teamId, athleteId: w.athleteId, topic: 'plan', weeks: [week] });
      if (mailTo.has(w.athleteId)) {
        await queueMail(ctx, tx, auth, week, w, version, slotLabel);
        emailsQueued += 1;
      }
    }
    return { teamRowCreated, check, athletesPublished: weeks.length, emailsQueued };
  });
  if (outcome.emailsQueued) ctx.services.mail.kick();
  const created = outcome.teamRowCreated || outcome.athletesPublished > 0;
  const publication = await getPublication(ctx, auth.teamId, week);
  return {
    created,
    result: {
      ...publication,
      alreadyPublished: !created,
      athletesPublished: outcome.athletesPublished,
      emailsQueued: outcome.emailsQueued,
      check: outcome.check,
    },
  };
}

// Publishing a week: records it once per team and week and, in the same transaction, queues one e-mail
// per athlete with their max-effort picks and connective-tissue work. Publishing again sends nothing.
import { inTransaction } from '../../db/transaction';
import { readTeamRules, type Publication } from '../../../shared/schemas';
import type { AppContext } from '../../context';
import type { Queryable } from '../../db/client';
import type { AuthContext } from '../../middleware/auth';
import { weeklyPlanMail, type WeeklyPick } from '../../services/mail/templates';
import { appLink, signUnsubscribeToken } from '../email/link-tokens';
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

async function queueWeekMails(ctx: AppContext, tx: Queryable, auth: AuthContext, week: string) {
  const recipients = await repo.weeklyRecipients(tx, auth.teamId);
  const picks = await repo.weekPicks(
    tx,
    auth.teamId,
    week,
    recipients.map((r) => r.athleteId),
  );
  const rules = readTeamRules(await repo.teamRulesOf(tx, auth.teamId));
  const slotOrder = new Map(rules.slots.map((s, i) => [s.id, i]));
  const slotLabel = new Map(rules.slots.map((s) => [s.id, s.label]));
  for (const r of recipients) {
    const mine: WeeklyPick[] = picks
      .filter((p) => p.athleteId === r.athleteId)
      .sort((a, b) => (slotOrder.get(a.slotId) ?? 99) - (slotOrder.get(b.slotId) ?? 99))
      .map((p) => ({
        slotLabel: slotLabel.get(p.slotId) ?? p.slotId,
        variantName: p.variantName,
        scheme: p.scheme,
        notes: p.notes,
      }));
    const tissue = await tissueWorkFor(tx, auth.teamId, r.athleteId, week);
    const unsubscribeUrl = appLink(ctx.env.APP_ORIGIN, '/api/email/unsubscribe', {
      token: await signUnsubscribeToken(ctx.env.SESSION_SECRET, r.userId),
    });
    const mail = weeklyPlanMail({
      athleteName: r.athleteName,
      teamName: auth.teamName,
      week,
      picks: mine,
      tissue: tissue.items,
      myWeekUrl: appLink(ctx.env.APP_ORIGIN, '/my-week'),
      unsubscribeUrl,
    });
    await ctx.services.mail.enqueue(tx, {
      kind: 'weekly_plan',
      dedupeKey: `${repo.weeklyDedupePrefix(auth.teamId, week)}${r.userId}`,
      teamId: auth.teamId,
      to: r.email,
      ...mail,
      headers: { 'List-Unsubscribe': `<${unsubscribeUrl}>`, 'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click' },
    });
  }
}

/** `created` is false when the week had been published before; nothing is queued then. */
export async function publishWeek(ctx: AppContext, auth: AuthContext, week: string) {
  const created = await inTransaction(ctx.database.db, async (tx) => {
    if (!(await repo.insertPublication(tx, auth.teamId, week, auth.userId))) return false;
    await queueWeekMails(ctx, tx, auth, week);
    return true;
  });
  if (created) ctx.services.mail.kick();
  return { created, publication: await getPublication(ctx, auth.teamId, week) };
}

// The outbox under failure: with its own database and its own SMTP stand-in (on free ports), publishing
// while SMTP is down keeps the mail queued with back-off; once SMTP is back every message arrives once.
// Several senders on one database never send the same message twice.
import { afterAll, describe, expect, it } from 'vitest';
import { mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { join } from 'node:path';
import { eq, isNull } from 'drizzle-orm';
import { outbox, planEntries } from '../../server/db/schema';
import { createLogger } from '../../server/lib/logger';
import { createMailService } from '../../server/services/mail';
import { retryDelayMs } from '../../server/services/mail/outbox';
import { queueMail } from '../../server/services/mail/outbox.repository';
import { inboxClient, startSmtpStandInAt, type SmtpStandIn } from '../../server/standins/smtp';
import { addWeeks, weekOfDate } from '../../shared/engine/weeks';
import { recreateDatabase } from '../support/integration-setup';
import { useTestApp } from '../support/app';
import { createAthlete, createTeam, createUser, createVariant, uniq } from '../support/factories';

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = createServer();
    srv.once('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const { port } = srv.address() as { port: number };
      srv.close(() => resolve(port));
    });
  });
}

const [smtpPort, inboxPort] = [await freePort(), await freePort()];
const databaseUrl = await recreateDatabase('rackturn_outbox_test');
const dataDir = mkdtempSync(join(process.env.TMPDIR ?? '/tmp', 'rackturn-outbox-mail-'));
const t = useTestApp({
  DATABASE_URL: databaseUrl,
  SMTP_PORT: String(smtpPort),
  MAIL_SEND_INTERVAL_MS: '100',
  MAIL_RETRY_BASE_MS: '200',
  MAIL_RETRY_MAX_MS: '800',
});
const inbox = inboxClient(`http://127.0.0.1:${inboxPort}`);
let smtp: SmtpStandIn | null = null;
const startSmtp = async () => (smtp = await startSmtpStandInAt({ smtpPort, inboxPort, dataDir }));

afterAll(async () => {
  await smtp?.stop();
  rmSync(dataDir, { recursive: true, force: true });
});

async function until<T>(what: string, probe: () => Promise<T | false>, timeoutMs = 15_000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const v = await probe();
    if (v !== false) return v;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

describe('retry delays', () => {
  it('double from the base on each failure, up to the cap', () => {
    expect([1, 2, 3, 4, 5, 6].map((n) => retryDelayMs(n, 30_000, 3_600_000))).toEqual([
      30_000, 60_000, 120_000, 240_000, 480_000, 960_000,
    ]);
    expect(retryDelayMs(12, 30_000, 3_600_000)).toBe(3_600_000);
    expect(retryDelayMs(500, 30_000, 3_600_000)).toBe(3_600_000);
  });
});

describe('an SMTP outage', () => {
  it('delays the weekly e-mails and loses none; after it every athlete gets one', async () => {
    const db = t.ctx.database.db;
    const team = await createTeam(db);
    const variant = await createVariant(db, team.teamId);
    const emails = [team.athleteUser.email];
    const athleteIds = [team.athleteId];
    for (let i = 0; i < 4; i++) {
      const u = await createUser(db, team.teamId, 'athlete');
      athleteIds.push(await createAthlete(db, team.teamId, { userId: u.id }));
      emails.push(u.email);
    }
    const week = addWeeks(weekOfDate(new Date()), 1);
    // Each athlete has a pick: a week without any max-effort work sends no e-mail.
    await db.insert(planEntries).values(
      athleteIds.map((athleteId) => ({
        teamId: team.teamId,
        athleteId,
        week,
        slotId: 'lower',
        variantId: variant,
        source: 'engine' as const,
        reasons: [],
      })),
    );

    const coach = await t.signIn(team.coach.email);
    expect((await coach.post(`/api/weeks/${week}/publish`)).status).toBe(201);

    // The sender keeps trying, further apart each time, and records why it failed.
    const failing = await until('two failed attempts on every message', async () => {
      const rows = await db.select().from(outbox).where(eq(outbox.teamId, team.teamId));
      return rows.length === emails.length && rows.every((r) => r.attempts >= 2) ? rows : false;
    });
    for (const row of failing) {
      expect(row.sentAt).toBeNull();
      expect(row.lastError).toMatch(/ECONNREFUSED|connect/i);
    }
    expect((await coach.get(`/api/weeks/${week}/publication`)).body).toMatchObject({ queued: 5, sent: 0 });
    // Publishing again while mail waits queues nothing more.
    expect((await coach.post(`/api/weeks/${week}/publish`)).body.alreadyPublished).toBe(true);

    const downFor = Date.now();
    await startSmtp();
    await until('every message sent', async () => {
      const waiting = await db.select().from(outbox).where(isNull(outbox.sentAt));
      return waiting.length === 0 ? true : false;
    });
    console.info(`outbox drained ${Date.now() - downFor} ms after the SMTP stand-in came back`);
    await t.ctx.services.mail.sendDue();
    for (const email of emails) expect(await inbox.list({ to: email })).toHaveLength(1);
    expect(await inbox.list()).toHaveLength(emails.length);
    const rows = await db.select().from(outbox).where(eq(outbox.teamId, team.teamId));
    expect(rows.every((r) => r.sentAt !== null && r.lastError === null)).toBe(true);
    expect((await coach.get(`/api/weeks/${week}/publication`)).body).toMatchObject({ queued: 0, sent: 5 });
    await inbox.clear();
  });
});

describe('several senders on one database', () => {
  it('never send one message twice', async () => {
    if (!smtp) await startSmtp();
    const db = t.ctx.database.db;
    const tag = uniq();
    const addresses = Array.from({ length: 40 }, (_, i) => `many-${tag}-${i}@example.test`);
    for (const to of addresses)
      await queueMail(db, {
        kind: 'password_changed',
        dedupeKey: `test:${to}`,
        to,
        subject: 'Hi',
        text: 'x',
        html: '<p>x</p>',
      });
    // Three more instances (each with its own pool) race the app's own sender loop.
    const logger = createLogger('silent');
    const senders = [0, 1, 2].map(() => createMailService({ ...t.ctx.env, MAIL_SEND_INTERVAL_MS: 0 }, logger));
    const passes = await Promise.all(senders.map((s) => s.sendDue()));
    await Promise.all(senders.map((s) => s.stop()));
    await until('all sent', async () => {
      const waiting = await db.select().from(outbox).where(isNull(outbox.sentAt));
      return waiting.length === 0 ? true : false;
    });
    const total = passes.reduce((n, p) => n + p.sent, 0);
    console.info(`sent by the racing senders: ${passes.map((p) => p.sent).join(' + ')} = ${total} of 40`);
    expect(total).toBeLessThanOrEqual(40);
    for (const to of addresses) expect(await inbox.list({ to })).toHaveLength(1);
  });

  it('queues a dedupe key once', async () => {
    const mail = {
      kind: 'password_changed' as const,
      dedupeKey: `once-${uniq()}`,
      to: 'once@example.test',
      subject: 'A',
      text: 'a',
      html: 'a',
    };
    expect(await queueMail(t.ctx.database.db, mail)).toBe(true);
    expect(await queueMail(t.ctx.database.db, { ...mail, subject: 'B' })).toBe(false);
    const rows = await t.ctx.database.db.select().from(outbox).where(eq(outbox.dedupeKey, mail.dedupeKey));
    expect(rows.map((r) => r.subject)).toEqual(['A']);
  });

  it('a stopped sender sends nothing more', async () => {
    await t.ctx.services.mail.stop();
    const to = `after-stop-${uniq()}@example.test`;
    await queueMail(t.ctx.database.db, {
      kind: 'password_changed',
      dedupeKey: `stop:${to}`,
      to,
      subject: 'Late',
      text: 'x',
      html: 'x',
    });
    t.ctx.services.mail.kick();
    await new Promise((r) => setTimeout(r, 600));
    const [row] = await t.ctx.database.db.select().from(outbox).where(eq(outbox.toEmail, to));
    expect(row!.sentAt).toBeNull();
    expect(await inbox.list({ to })).toHaveLength(0);
  });
});

describe('the SMTP stand-in', () => {
  it('keeps what arrived across a restart, and can be cleared', async () => {
    if (!smtp) await startSmtp();
    const sender = createMailService({ ...t.ctx.env, MAIL_SEND_INTERVAL_MS: 0 }, createLogger('silent'));
    const to = `kept-${uniq()}@example.test`;
    await queueMail(t.ctx.database.db, {
      kind: 'password_changed',
      dedupeKey: `kept:${to}`,
      to,
      subject: 'Kept',
      text: 'kept',
      html: '<p>kept</p>',
    });
    await sender.sendDue();
    await sender.stop();
    expect(await inbox.list({ to })).toHaveLength(1);
    await smtp!.stop();
    await startSmtp();
    const [kept] = await inbox.messagesTo(to);
    expect(kept).toMatchObject({ subject: 'Kept', text: 'kept\n', to: [to] });
    const page = await fetch(`http://127.0.0.1:${inboxPort}/`);
    expect(await page.text()).toContain('Kept');
    const html = await fetch(`http://127.0.0.1:${inboxPort}/messages/${kept!.id}/html`);
    expect(await html.text()).toContain('<p>kept</p>');
    await inbox.clear();
    expect(await inbox.list()).toEqual([]);
  });
});

// The e-mail templates and link tokens: every value is escaped, HTML and text say the same things,
// nothing is loaded from elsewhere, and tokens are what they claim to be.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { createHash } from 'node:crypto';
import { SignJWT } from 'jose';
import { escapeHtml, html, renderMail } from '../../server/services/mail/layout';
import { invitationMail, passwordResetMail, tissueDose, weeklyPlanMail } from '../../server/services/mail/templates';
import {
  hashLinkToken,
  newLinkToken,
  signUnsubscribeToken,
  verifyUnsubscribeToken,
} from '../../server/lib/link-tokens';
import type { TissuePrescription } from '../../shared/engine/tissue';

const SECRET = 'a-test-secret-a-test-secret-a-test-secret';

describe('escaping', () => {
  it('escapes every interpolated value, whatever it holds', () => {
    fc.assert(
      fc.property(fc.string(), (s) => {
        const escaped = escapeHtml(s);
        expect(escaped).not.toMatch(/[<>"']/);
        expect(escaped.replace(/&(amp|lt|gt|quot|#39);/g, '')).not.toContain('&');
        expect(html`<p title="${s}">${s}</p>`.value).toBe(`<p title="${escaped}">${escaped}</p>`);
      }),
    );
  });

  it('keeps a hostile team, inviter or variant name inert in the HTML', () => {
    const evil = '<img src=x onerror=alert(1)>"\'&';
    const mail = invitationMail({
      teamName: evil,
      inviterName: evil,
      role: 'athlete',
      url: 'http://127.0.0.1:3000/accept-invitation?token=abc',
      expiresAt: new Date('2027-03-08T10:00:00Z'),
    });
    expect(mail.html).not.toContain('<img');
    expect(mail.html).toContain('&lt;img src=x onerror=alert(1)&gt;&quot;&#39;&amp;');
    expect(mail.text).toContain(evil);
    expect(mail.subject).toBe(`Join ${evil} on Rackturn`);
  });
});

describe('templates', () => {
  const tissue: TissuePrescription[] = [
    {
      week: '2027-W10',
      joint: 'elbow',
      kind: 'isometric',
      exercise: 'Elbow extension pulses against a fixed strap',
      instructions: ['Build up slowly.'],
      dose: { seconds: 3.5, pulsesPerAngle: 3, angles: [10, 70, 130] },
      sessionsPerWeek: 3,
    },
  ];
  const weekly = weeklyPlanMail({
    athleteName: 'Mira Tannhauser',
    teamName: 'Harbour Iron',
    week: '2027-W10',
    picks: [{ slotLabel: 'Lower max effort', variantName: 'Pin squat', scheme: 'five', notes: null }],
    tissue,
    myWeekUrl: 'http://127.0.0.1:3000/my-week',
    unsubscribeUrl: 'http://127.0.0.1:3000/api/email/unsubscribe?token=t',
  });

  it('dates the weekly e-mail by the Monday of the ISO week', () => {
    // 2027-W10 starts on Monday 8 March 2027 (ISO 8601 week dates).
    expect(weekly.subject).toBe('Your week of 8 March: Harbour Iron');
    expect(weekly.text).toContain('Hi Mira, your coach has published the plan for the week of 8 March (2027-W10).');
  });

  it('says the same in text and HTML', () => {
    for (const phrase of [
      'Lower max effort: Pin squat',
      'Work up to a top set of five',
      'Elbow extension pulses against a fixed strap',
      '3 pulses of 3.5 s at 10°, 70°, 130°',
      '3 sessions this week',
      'Open My week',
      'Stop the set on sharp or unusual pain.',
      'Stop these weekly e-mails',
    ]) {
      expect(weekly.text).toContain(phrase);
      expect(weekly.html).toContain(escapeHtml(phrase));
    }
  });

  it('loads nothing from elsewhere and tracks nobody', () => {
    for (const mail of [
      weekly,
      passwordResetMail({ url: 'http://127.0.0.1:3000/reset-password?token=t', validMinutes: 60 }),
    ]) {
      expect(mail.html).not.toMatch(/<img|<link|<script|url\(|@import/i);
      const hosts = new Set([...mail.html.matchAll(/https?:\/\/[^/"'\s]+/g)].map((m) => m[0]));
      expect(hosts).toEqual(new Set(['http://127.0.0.1:3000']));
    }
  });

  it('describes every kind of tissue dose in words', () => {
    const base = { week: '2027-W10', joint: 'knee' as const, exercise: 'x', instructions: [], sessionsPerWeek: 3 };
    expect(tissueDose({ ...base, kind: 'highRep', dose: { reps: 100, band: 'light' } })).toBe(
      '100 easy reps with a light band',
    );
    // Still sore on the lightest band: the reps stay, split into easy sets.
    expect(tissueDose({ ...base, kind: 'highRep', dose: { reps: 100, band: 'lightest', easySets: 4 } })).toBe(
      '100 easy reps with the lightest band, split into 4 easy sets with short rests',
    );
    expect(tissueDose({ ...base, kind: 'loadedStretch', dose: { fatigueReps: 25, holdSeconds: 135 } })).toBe(
      '25 light reps, then hold the stretch for 2 min 15 s',
    );
  });

  it('renders an empty list with its own words', () => {
    const out = renderMail({
      subject: 's',
      preheader: 'p',
      title: 't',
      blocks: [{ type: 'list', items: [], empty: 'Nothing here.' }],
      footer: [],
    });
    expect(out.text).toContain('Nothing here.');
    expect(out.html).toContain('Nothing here.');
  });
});

describe('link tokens', () => {
  it('are 32 random bytes, stored only as their SHA-256', () => {
    const a = newLinkToken();
    const b = newLinkToken();
    expect(a.token).toMatch(/^[A-Za-z0-9_-]{43}$/);
    expect(Buffer.from(a.token, 'base64url')).toHaveLength(32);
    expect(a.token).not.toBe(b.token);
    expect(a.hash).toBe(createHash('sha256').update(a.token).digest('hex'));
    expect(hashLinkToken(a.token)).toBe(a.hash);
  });

  it('unsubscribe tokens name their user and purpose, and nothing else passes', async () => {
    const token = await signUnsubscribeToken(SECRET, 42);
    expect(await verifyUnsubscribeToken(SECRET, token)).toBe(42);
    expect(await verifyUnsubscribeToken(`${SECRET}-other`, token)).toBeNull();
    const key = new TextEncoder().encode(SECRET);
    const noPurpose = await new SignJWT({ tid: 1 }).setProtectedHeader({ alg: 'HS256' }).setSubject('42').sign(key);
    expect(await verifyUnsubscribeToken(SECRET, noPurpose)).toBeNull();
    const expired = await new SignJWT({ purpose: 'weekly-email-unsubscribe' })
      .setProtectedHeader({ alg: 'HS256' })
      .setSubject('42')
      .setExpirationTime(Math.floor(Date.now() / 1000) - 10)
      .sign(key);
    expect(await verifyUnsubscribeToken(SECRET, expired)).toBeNull();
    expect(await verifyUnsubscribeToken(SECRET, 'not-a-token')).toBeNull();
  });
});

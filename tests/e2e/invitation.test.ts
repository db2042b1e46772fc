// A head coach invites a new athlete from the Roster page; the athlete opens the link from the e-mail
// that reached the local SMTP stand-in, sets a name and password, and lands on My week.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { inboxClient } from '../../server/standins/smtp';
import { openBrowser, signInAs, type Browser } from './support/browser';

let coach: Browser;
let athlete: Browser;
const email = `new-athlete-${Date.now().toString(36)}@example.test`;
const inbox = inboxClient();
let link = '';

beforeAll(async () => {
  coach = await openBrowser();
  athlete = await openBrowser({ width: 375, height: 812 });
});
afterAll(async () => {
  await coach?.close();
  await athlete?.close();
});

describe('inviting an athlete', () => {
  it('the head coach sends an invitation from the Roster page', async () => {
    await signInAs(coach, 'coach@rackturn.test');
    await coach.page.goto(`${coach.baseUrl}/roster`);
    const form = coach.page.getByRole('form', { name: 'Invite by e-mail' });
    await form.getByLabel('E-mail').fill(email);
    await form.getByLabel('Athlete', { exact: true }).check();
    await form.getByLabel('Roster entry').selectOption({ label: 'New roster entry' });
    await form.getByLabel('Athlete’s name').fill('Saskia Brenneman');
    await form.getByLabel('Competes in').selectOption('F');
    await form.getByRole('button', { name: 'Send invitation' }).click();
    await expect(form.getByRole('status').textContent()).resolves.toContain(`Invitation sent to ${email}`);
    const open = coach.page.getByRole('list', { name: 'Open invitations' });
    await expect(open.getByText(email).count()).resolves.toBe(1);
  });

  it('the e-mail arrives with a link into the app', async () => {
    const [mail] = await inbox.waitFor(email, { timeoutMs: 15_000 });
    expect(mail!.subject).toBe('Join Copperkettle Barbell Club on Rackturn');
    const m = /(http:\/\/\S+\/accept-invitation\?token=[A-Za-z0-9_-]{43})/.exec(mail!.text);
    expect(m).not.toBeNull();
    link = m![1]!;
    expect(link.startsWith(athlete.baseUrl)).toBe(true);
  });

  it('the athlete accepts on a phone and sees My week', async () => {
    const page = athlete.page;
    await page.goto(link);
    // The page loads lazily: wait for it rather than look at once.
    await page.getByRole('heading', { name: 'Accept invitation' }).waitFor();
    await page.getByText(email).waitFor();
    await page.getByLabel('Your name').fill('Saskia Brenneman');
    await page.getByLabel('Choose a password').fill('saskia-lifts-heavy');
    await page.getByLabel('The password again').fill('saskia-lifts-heavy');
    await page.getByRole('button', { name: 'Join the team' }).click();
    await page.waitForURL(/\/my-week$/);
    await page.getByRole('heading', { name: 'My week', level: 1 }).waitFor();
    const nav = await page.getByRole('navigation', { name: 'Main' }).getByRole('link').allTextContents();
    expect(nav).toContain('My week');
  });

  it('the link works only once', async () => {
    const page = athlete.page;
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(/\/sign-in/);
    await page.goto(link);
    await page.getByRole('heading', { name: 'Invitation already used' }).waitFor();
  });

  it('raised no console errors beyond signed-out checks and the refused reuse of the link', () => {
    // Signed-out pages log the 401 of the who-am-I check, and the used link its 410; nothing else may.
    const unexpected = (list: string[]) => list.filter((p) => !p.includes('401') && !p.includes('410'));
    expect(unexpected(coach.problems)).toEqual([]);
    expect(unexpected(athlete.problems)).toEqual([]);
  });
});

// The whole training week in the browser: the coach opens an athlete's week of four sessions, sets the
// speed work and an accessory, is told plainly about a percentage out of range, saves; then the athlete
// reads the session on a 375 px phone screen and logs it. Both pages pass axe-core.
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import mysql from 'mysql2/promise';
import { weekOfDate } from '../../shared/engine/weeks';
import { axeViolations } from './support/axe';
import { openBrowser, signInAs, type Browser } from './support/browser';

const thisWeek = weekOfDate(new Date());
let b: Browser;
let db: mysql.Connection;
let noorId: number;

beforeAll(async () => {
  db = await mysql.createConnection({ uri: inject('e2eDatabaseUrl') });
  const [[noor]] = (await db.query("SELECT id FROM athletes WHERE name = 'Noor Halvorsen'")) as unknown as [
    { id: number }[],
  ];
  noorId = noor!.id;
  b = await openBrowser({ width: 1280, height: 900 });
});
afterAll(async () => {
  await b?.close();
  await db?.end();
});

describe('the training week', () => {
  it('the head coach sees the four sessions in the rules and moves one to another day', async () => {
    await signInAs(b, 'coach@rackturn.test');
    await b.page.goto(`${b.baseUrl}/rules`);
    const names = b.page.getByLabel('Session name');
    await names.first().waitFor();
    expect(await names.count()).toBe(4);
    const days = b.page.getByLabel('Day', { exact: true });
    await days.nth(2).selectOption({ label: 'Thursday' });
    await b.page.getByRole('button', { name: 'Save rules' }).click();
    await b.page.getByText(/The rules are saved/).waitFor();
    expect(await axeViolations(b.page)).toEqual([]);
    const [[row]] = (await db.query(
      'SELECT r.rules FROM team_rules r JOIN teams t ON t.id = r.team_id WHERE t.name = ?',
      ['Copperkettle Barbell Club'],
    )) as unknown as [{ rules: string | { sessions: { id: string; weekday: number }[] } }[]];
    const rules = (typeof row!.rules === 'string' ? JSON.parse(row!.rules) : row!.rules) as {
      sessions: { id: string; weekday: number }[];
    };
    expect(rules.sessions.find((x) => x.id === 'lower-speed')!.weekday).toBe(4);
  });

  it('the coach sets up the week’s four sessions for an athlete', async () => {
    await b.page.goto(`${b.baseUrl}/athletes/${noorId}`);
    await b.page.getByRole('link', { name: 'Training week' }).click();
    await b.page.waitForURL(new RegExp(`/athletes/${noorId}/weeks/${thisWeek}$`));
    const form = b.page.getByRole('form', { name: `Training week ${thisWeek}` });
    const sessions = form.locator('section h2');
    await sessions.first().waitFor();
    expect(await sessions.count()).toBe(4);
    const upper = form.locator('section', { has: b.page.getByRole('heading', { name: /^Upper speed/ }) });

    // Out of range: a clear message, nothing saved.
    await upper.getByLabel('% of training max').fill('25');
    await form.getByRole('button', { name: 'Save the week' }).click();
    await upper.getByText('Use 30 to 100 %').waitFor();

    await upper.getByLabel('% of training max').fill('55');
    await upper.getByLabel('Sets').first().fill('8');
    await upper.getByLabel('Bands or chains').selectOption('bands');
    await upper.getByRole('button', { name: 'Add an accessory' }).click();
    const last = upper.getByLabel('Exercise name').last();
    await last.fill('Dumbbell row');
    await form.getByRole('button', { name: 'Save the week' }).click();
    await form.getByText('Week saved.').waitFor();
    expect(await axeViolations(b.page)).toEqual([]);
    const [[row]] = (await db.query('SELECT work FROM athlete_weeks WHERE athlete_id = ? AND week = ?', [
      noorId,
      thisWeek,
    ])) as unknown as [{ work: string | Record<string, unknown> }[]];
    const work = (typeof row!.work === 'string' ? JSON.parse(row!.work) : row!.work) as Record<
      string,
      { speed: { pct: number; sets: number; accommodation: string }; accessories: { name: string }[] }
    >;
    expect(work['upper-speed']!.speed).toMatchObject({ pct: 55, sets: 8, accommodation: 'bands' });
    expect(work['upper-speed']!.accessories.map((a) => a.name)).toContain('Dumbbell row');
    await b.page.getByRole('button', { name: 'Sign out' }).click();
  });

  it('the athlete sees the session on a phone and logs it', async () => {
    await b.page.setViewportSize({ width: 375, height: 812 });
    await signInAs(b, 'athlete@rackturn.test');
    await b.page.waitForURL(/\/my-week$/);
    const list = b.page.locator('section', { has: b.page.getByRole('heading', { name: 'This week’s sessions' }) });
    const upper = list.locator('details', { has: b.page.getByRole('heading', { name: 'Upper speed' }) });
    if (!(await upper.evaluate((d) => (d as HTMLDetailsElement).open))) await upper.locator('summary').click();
    await upper.getByText(/Speed: Bench press 8 × 3 at 55 % .* on the bar \+ bands/).waitFor();
    await upper.getByText('Dumbbell row').waitFor();
    await upper.getByRole('button', { name: 'One more set: Sets done, Dumbbell row' }).click();
    await upper.getByRole('button', { name: /^(Session done|Mark not done)$/ }).click();
    await upper.getByText(/^Session marked done\.$|^Saved\.$/).waitFor();
    expect(await b.page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(375);
    expect(await axeViolations(b.page)).toEqual([]);
  });

  it('the athlete sees the back-off sets under a top set on a phone and ticks one; it stays ticked', async () => {
    // Still the athlete on the 375 px screen. The club's rules: two back-off sets 10 % lighter.
    const backOff = b.page.getByRole('group', { name: 'Back-off sets' }).first();
    await backOff.waitFor();
    await backOff.getByText(/10 % lighter than the (top set you logged|suggested top set)/).waitFor();
    const sets = backOff.getByRole('checkbox');
    expect(await sets.count()).toBe(2);
    const first = sets.first();
    const label = (await backOff.locator('label').first().innerText()).trim();
    expect(label).toMatch(/^Back-off set 1 done:\s*\d+(\.\d+)?\skg × \d+$/);
    const wasTicked = await first.isChecked();
    const saved = b.page.waitForResponse(
      (r) => r.url().includes('/api/my-week/sessions/') && r.request().method() === 'PUT',
    );
    await first.setChecked(!wasTicked);
    expect((await saved).status()).toBe(200);
    expect(await b.page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(375);
    expect(await axeViolations(b.page)).toEqual([]);
    await b.page.reload();
    const again = b.page.getByRole('group', { name: 'Back-off sets' }).first().getByRole('checkbox').first();
    await again.waitFor();
    expect(await again.isChecked()).toBe(!wasTicked);
    const [[log]] = (await db.query(
      "SELECT l.back_off_done AS done FROM session_logs l JOIN athletes a ON a.id = l.athlete_id JOIN users u ON u.id = a.user_id WHERE u.email = 'athlete@rackturn.test' AND l.week = ? AND JSON_LENGTH(l.back_off_done) > 0",
      [thisWeek],
    )) as unknown as [{ done: string | boolean[] }[]];
    const done = typeof log!.done === 'string' ? (JSON.parse(log!.done) as boolean[]) : log!.done;
    expect(done[0]).toBe(!wasTicked);
  });
});

// The first glance of My week as plain escaped HTML: the signed-in frame and this week's picks (slot, name,
// scheme) drawn with the classes the app's own page uses, so the picks stand where the app draws them a moment
// later, when it replaces this markup. Only what the app shows first; the rest of the page comes with the app.
import escapeHtml from 'escape-html';
import { addWeeks } from '../../../shared/engine/weeks';
import {
  LIFT_NAME,
  MY_WEEK_DRAFT_NOTICE,
  MY_WEEK_EMPTY_NOTICE,
  SCHEME_GOAL_LABEL,
  TRAINING_CAUTION_TEXT,
  weekSpanLabel,
} from '../../../shared/labels';
import type { Me, MyWeek, MyWeekPick } from '../../../shared/schemas';

const SKIP_LINK =
  'sr-only focus:not-sr-only focus:fixed focus:left-2 focus:top-2 focus:z-50 focus:rounded-md focus:bg-chalk-50 focus:px-3 focus:py-2 focus:font-semibold focus:text-ink-900 focus:shadow-lg';
const TAB = 'flex min-h-11 items-center whitespace-nowrap rounded-md px-3 font-semibold';
const TAB_ON = `${TAB} bg-ink-700 text-chalk-50 shadow-[inset_0_-3px_0_#c4582f]`;
const TAB_OFF = `${TAB} text-ink-200 hover:bg-ink-800 hover:text-chalk-50`;
const WEEK_LINK =
  'inline-flex min-h-11 items-center rounded-md border border-ink-300 bg-chalk-50 px-3 font-semibold text-ink-800 hover:bg-chalk-200';

/** An athlete's tabs in the top bar. */
const ATHLETE_TABS = [
  { href: '/my-week', label: 'My week' },
  { href: '/my-history', label: 'My history' },
  { href: '/my-fee', label: 'Coaching fee' },
];

const h = (value: string | number) => escapeHtml(String(value));

function frame(me: Me, page: string): string {
  const tabs = ATHLETE_TABS.map((t) =>
    t.href === '/my-week'
      ? `<li><a aria-current="page" class="${TAB_ON}" href="${t.href}">${h(t.label)}</a></li>`
      : `<li><a class="${TAB_OFF}" href="${t.href}">${h(t.label)}</a></li>`,
  ).join('');
  // The account menu and Sign out need the app: drawn in place (so the bar keeps its height) but inert.
  const account =
    '<div class="ml-auto flex items-center gap-3 text-sm" inert>' +
    '<div class="relative"><button type="button" aria-expanded="false" class="flex min-h-11 items-center gap-2 rounded-md px-2 text-left leading-tight hover:bg-ink-800">' +
    `<span class="hidden sm:block"><span class="block font-semibold text-chalk-50">${h(me.name)}</span>` +
    `<span class="text-ink-300">Athlete · ${h(me.teamName)}</span></span>` +
    '<span class="font-semibold text-chalk-50 sm:hidden">Account</span><span aria-hidden="true" class="text-ink-300">▾</span></button></div>' +
    '<button type="button" class="min-h-11 rounded-md border border-ink-500 px-3 font-semibold text-chalk-100 hover:bg-ink-800">Sign out</button>' +
    '</div>';
  return (
    '<div class="min-h-dvh" data-first-glance="">' +
    `<a href="#main" class="${SKIP_LINK}">Skip to main content</a>` +
    '<header class="bg-ink-900 text-chalk-100 print:hidden">' +
    '<div class="mx-auto flex max-w-screen-2xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-2">' +
    '<a class="flex items-center gap-2 text-xl font-bold tracking-wide text-chalk-50" href="/">' +
    '<span aria-hidden="true" class="inline-block h-4 w-6 rounded-sm border-x-4 border-rust-500 bg-chalk-100"></span>Rackturn</a>' +
    `<nav aria-label="Main" class="order-3 w-full overflow-x-auto sm:order-none sm:w-auto"><ul class="flex gap-1">${tabs}</ul></nav>` +
    account +
    '</div><div class="h-0.5"></div></header>' +
    `<main id="main" tabindex="-1" class="mx-auto outline-none max-w-screen-2xl px-3 py-4 sm:px-6 sm:py-6">${page}</main>` +
    '</div>'
  );
}

function pickHeader(pick: MyWeekPick): string {
  const id = `pick-${pick.planEntryId}`;
  return (
    `<section aria-labelledby="${id}" class="flex flex-col gap-4 rounded-lg border border-ink-200 bg-chalk-50 p-4 shadow-sm">` +
    '<header class="flex flex-col gap-1">' +
    `<p class="text-sm font-semibold uppercase tracking-wide text-rust-600">${h(pick.slotLabel)} · ${h(LIFT_NAME[pick.variant.lift])}</p>` +
    `<h2 id="${id}" class="text-2xl font-bold leading-tight text-ink-900">${h(pick.variant.name)}</h2>` +
    `<p class="text-lg font-semibold text-ink-800">${h(SCHEME_GOAL_LABEL[pick.scheme])}</p>` +
    (pick.variant.notes ? `<p class="text-ink-600">${h(pick.variant.notes)}</p>` : '') +
    '</header></section>'
  );
}

const notice = (text: string) =>
  `<div role="status" class="rounded-md border p-3 border-ink-300 bg-chalk-50 text-ink-800"><div>${h(text)}</div></div>`;

const caution =
  '<aside aria-label="Training caution" class="flex gap-2 rounded-md border border-caution-600/40 bg-caution-100 p-3 text-sm text-ink-800 ">' +
  '<svg width="18" height="18" viewBox="0 0 20 20" fill="none" stroke="currentColor" stroke-width="2" aria-hidden="true" class="mt-0.5 shrink-0 text-caution-700">' +
  '<path d="M10 2.5l8 14.5H2z" stroke-linejoin="round"></path><path d="M10 8v4M10 14.5v.5" stroke-linecap="round"></path></svg>' +
  `<p>${h(TRAINING_CAUTION_TEXT)}</p></aside>`;

/** My week as the app first draws it for this athlete and week (`requested` null: this week). */
export function firstGlanceMarkup(me: Me, week: MyWeek, requested: string | null): string {
  const meet = week.meet && week.meet.daysOut >= 0 ? ` · ${week.meet.name} in ${week.meet.daysOut} days` : '';
  const weekLink = (to: string, label: string) => `<a class="${WEEK_LINK}" href="${h(to)}">${h(label)}</a>`;
  const picks = !week.published
    ? notice(MY_WEEK_DRAFT_NOTICE)
    : week.picks.length === 0
      ? notice(MY_WEEK_EMPTY_NOTICE)
      : week.picks.map(pickHeader).join('');
  const page =
    '<div class="mx-auto flex max-w-3xl flex-col gap-4">' +
    '<div class="mb-4 flex flex-wrap items-end justify-between gap-3"><div>' +
    '<h1 class="text-2xl font-bold tracking-tight text-ink-900 sm:text-3xl">My week</h1>' +
    `<p class="mt-1 text-ink-600">${h(`${week.week} · ${weekSpanLabel(week.week)}${meet}`)}</p>` +
    '</div></div>' +
    '<nav aria-label="Weeks" class="flex flex-wrap gap-2">' +
    weekLink(`/my-week?week=${addWeeks(week.week, -1)}`, '← Previous week') +
    (requested ? weekLink('/my-week', 'This week') : '') +
    weekLink(`/my-week?week=${addWeeks(week.week, 1)}`, 'Next week →') +
    '</nav>' +
    picks +
    caution +
    '</div>';
  return frame(me, page);
}

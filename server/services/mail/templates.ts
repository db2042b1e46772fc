// The words of every e-mail Rackturn sends, in both HTML and plain text (see layout.ts for the look).
import { mondayOf } from '../../../shared/engine/weeks';
import { TISSUE_CAUTION, type TissuePrescription } from '../../../shared/engine/tissue';
import { SCHEME_GOAL_LABEL, tissueSessionsLabel } from '../../../shared/labels';
import { renderMail, type Block } from './layout';

export interface RenderedMail {
  subject: string;
  html: string;
  text: string;
}

const dateFmt = new Intl.DateTimeFormat('en-GB', {
  weekday: 'long',
  day: 'numeric',
  month: 'long',
  year: 'numeric',
  timeZone: 'UTC',
});
const dayMonth = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long', timeZone: 'UTC' });

const TRAINING_CAUTION = [
  'Stop the set on sharp or unusual pain.',
  'For an injury, see a licensed clinician: Rackturn plans training and is not medical advice.',
  'Follow the rules of your federation and your gym.',
];

export function invitationMail(m: {
  teamName: string;
  inviterName: string | null;
  role: 'coach' | 'athlete';
  url: string;
  expiresAt: Date;
}): RenderedMail {
  const who = m.inviterName ?? 'Your head coach';
  const as = m.role === 'coach' ? 'a coach' : 'an athlete';
  return renderMail({
    subject: `Join ${m.teamName} on Rackturn`,
    preheader: `${who} added you to ${m.teamName} as ${as}.`,
    title: `You're invited to ${m.teamName}`,
    blocks: [
      {
        type: 'paragraph',
        text: `${who} added you to ${m.teamName} on Rackturn as ${as}. ${
          m.role === 'coach'
            ? 'You will plan and review the team’s max-effort work with them.'
            : 'Your coach plans your max-effort work there, and you log your top sets there.'
        }`,
      },
      { type: 'paragraph', text: 'Set your name and a password to get started:' },
      { type: 'button', label: 'Accept the invitation', url: m.url },
      {
        type: 'paragraph',
        text: `The link works once and until ${dateFmt.format(m.expiresAt)}. If it has run out, ask your coach to send a new one.`,
      },
      { type: 'link', label: 'If the button does not work, open this address:', url: m.url },
    ],
    footer: [
      {
        type: 'paragraph',
        text: 'Not expecting this? You can ignore it: nothing happens until the link is used.',
      },
    ],
  });
}

export function passwordResetMail(m: { url: string; validMinutes: number }): RenderedMail {
  return renderMail({
    subject: 'Choose a new Rackturn password',
    preheader: `A link to set a new password, valid for ${m.validMinutes} minutes.`,
    title: 'Choose a new password',
    blocks: [
      {
        type: 'paragraph',
        text: 'Someone asked to reset the Rackturn password for this address. If that was you, choose a new one here:',
      },
      { type: 'button', label: 'Choose a new password', url: m.url },
      {
        type: 'paragraph',
        text: `The link works once, within ${m.validMinutes} minutes. Setting a new password signs you out everywhere else.`,
      },
      { type: 'link', label: 'If the button does not work, open this address:', url: m.url },
    ],
    footer: [
      {
        type: 'paragraph',
        text: 'If you did not ask for this, ignore this e-mail: your password stays as it is.',
      },
    ],
  });
}

export function passwordChangedMail(m: { forgotUrl: string; when: Date }): RenderedMail {
  return renderMail({
    subject: 'Your Rackturn password was changed',
    preheader: 'If that was you, there is nothing to do.',
    title: 'Your password was changed',
    blocks: [
      {
        type: 'paragraph',
        text: `The password of your Rackturn account was changed on ${dateFmt.format(m.when)}, and every other session was signed out.`,
      },
      {
        type: 'paragraph',
        text: 'If that was you, there is nothing to do. If it was not, set a new password straight away:',
      },
      { type: 'button', label: 'Set a new password', url: m.forgotUrl },
    ],
    footer: [{ type: 'paragraph', text: 'You get this notice whenever the password of your account changes.' }],
  });
}

export interface WeeklyPick {
  slotLabel: string;
  variantName: string;
  scheme: 'single' | 'triple' | 'five';
  notes: string | null;
}

const BAND_WORDS = { lightest: 'the lightest band', light: 'a light band', medium: 'a medium band' } as const;

function seconds(s: number): string {
  if (s < 60) return `${s} s`;
  const min = Math.floor(s / 60);
  const rest = s % 60;
  return rest ? `${min} min ${rest} s` : `${min} min`;
}

/** One line saying how much of a connective-tissue item to do. */
export function tissueDose(item: TissuePrescription): string {
  switch (item.kind) {
    case 'highRep':
      return (
        `${item.dose.reps} easy reps with ${BAND_WORDS[item.dose.band]}` +
        (item.dose.easySets ? `, split into ${item.dose.easySets} easy sets with short rests` : '')
      );
    case 'isometric':
      return `${item.dose.pulsesPerAngle} pulses of ${seconds(item.dose.seconds)} at ${item.dose.angles.map((a) => `${a}°`).join(', ')}`;
    case 'loadedStretch':
      return `${item.dose.fatigueReps} light reps, then hold the stretch for ${seconds(item.dose.holdSeconds)}`;
  }
}

export function weeklyPlanMail(m: {
  athleteName: string;
  teamName: string;
  week: string;
  picks: WeeklyPick[];
  tissue: TissuePrescription[];
  myWeekUrl: string;
  unsubscribeUrl: string;
  /** Set for an update of a week sent before: what changed, one line each. */
  changes?: string[];
}): RenderedMail {
  const monday = mondayOf(m.week);
  const first = m.athleteName.split(/\s+/)[0] || m.athleteName;
  const update = m.changes !== undefined;
  const blocks: Block[] = [
    {
      type: 'paragraph',
      text: update
        ? `Hi ${first}, your coach has changed the plan for the week of ${dayMonth.format(monday)} (${m.week}).`
        : `Hi ${first}, your coach has published the plan for the week of ${dayMonth.format(monday)} (${m.week}).`,
    },
    ...(update
      ? [
          { type: 'heading' as const, text: 'What changed' },
          { type: 'list' as const, items: m.changes!.map((c) => ({ title: c, lines: [] })), empty: 'Nothing.' },
        ]
      : []),
    { type: 'heading', text: 'Max-effort work' },
    {
      type: 'list',
      items: m.picks.map((pick) => ({
        title: `${pick.slotLabel}: ${pick.variantName}`,
        lines: [SCHEME_GOAL_LABEL[pick.scheme], ...(pick.notes ? [pick.notes] : [])],
      })),
      empty: 'No max-effort work this week.',
    },
    { type: 'heading', text: 'Connective-tissue work' },
    {
      type: 'list',
      // The dose only: the step-by-step instructions are in My week, where the athlete does the work.
      items: m.tissue.map((t) => ({
        title: t.exercise,
        lines: [tissueDose(t), tissueSessionsLabel(t.sessionsPerWeek)],
      })),
      empty: 'None this week.',
    },
    ...(m.tissue.length > 0
      ? [{ type: 'paragraph' as const, text: 'How to do each one, step by step, is in My week.' }]
      : []),
    { type: 'button', label: 'Open My week', url: m.myWeekUrl },
    // The tissue caution's other lines repeat the training caution's.
    { type: 'caution', lines: [...TRAINING_CAUTION, ...TISSUE_CAUTION.filter((l) => l.includes('swollen'))] },
  ];
  return renderMail({
    subject: `${update ? 'Updated: your' : 'Your'} week of ${dayMonth.format(monday)}: ${m.teamName}`,
    preheader:
      update && m.changes!.length > 0
        ? m.changes!.join(' · ')
        : m.picks.length > 0
          ? m.picks.map((p) => `${p.slotLabel}: ${p.variantName}`).join(' · ')
          : 'Your week from your coach.',
    title: `Your week of ${dayMonth.format(monday)}`,
    blocks,
    footer: [
      {
        type: 'paragraph',
        text: `You get this e-mail when your coach at ${m.teamName} publishes a week.`,
      },
      { type: 'link', label: 'Stop these weekly e-mails', url: m.unsubscribeUrl },
    ],
  });
}

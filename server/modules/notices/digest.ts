// The daily e-mail summary of a coach's unread notices, and the signed link that turns it off.
import { renderMail } from '../../services/mail/layout';
import type { RenderedMail } from '../../services/mail/templates';
import { signPurposeToken, verifyPurposeToken } from '../../lib/link-tokens';

/** Only summary unsubscribe tokens carry this; the weekly-plan tokens and sessions are refused. */
const PURPOSE = 'notice-digest-unsubscribe';

export const signDigestToken = (secret: string, userId: number) => signPurposeToken(secret, PURPOSE, userId);

/** The user the token was made for, or null when forged, expired or made for something else. */
export const verifyDigestToken = (secret: string, token: string) => verifyPurposeToken(secret, PURPOSE, token);

export function noticeDigestMail(m: {
  coachName: string;
  items: { text: string; url: string }[];
  appUrl: string;
  unsubscribeUrl: string;
}): RenderedMail {
  const first = m.coachName.split(/\s+/)[0] || m.coachName;
  const n = m.items.length;
  return renderMail({
    subject: `${n} new ${n === 1 ? 'notice' : 'notices'} from your athletes`,
    preheader: m.items
      .slice(0, 3)
      .map((i) => i.text)
      .join(' · '),
    title: 'Your athletes since the last summary',
    blocks: [
      { type: 'paragraph', text: `Hi ${first}, here is what your athletes reported that you have not opened yet.` },
      { type: 'list', items: m.items.map((i) => ({ title: i.text, lines: [i.url] })) },
      { type: 'button', label: 'Open Rackturn', url: m.appUrl },
      {
        type: 'caution',
        lines: ['Pain reported by an athlete is not a diagnosis: for an injury, refer them to a licensed clinician.'],
      },
    ],
    footer: [
      { type: 'paragraph', text: 'You get this summary once a day when there are unread notices.' },
      { type: 'link', label: 'Stop these daily summaries', url: m.unsubscribeUrl },
    ],
  });
}

// The receipt e-mail sent when a fee payment is confirmed, in the product's mail layout.
import { formatMoney } from '../../../shared/schemas';
import { renderMail } from '../../services/mail/layout';
import type { OutgoingMail } from '../../services/mail';

export interface ReceiptInput {
  invoiceId: string;
  invoiceNumber: string | null;
  teamId: number;
  teamName: string;
  athleteName: string;
  to: string;
  planName: string | null;
  amountMinor: number;
  currency: string;
  paidAt: Date;
  periodEnd: Date | null;
  appOrigin: string;
}

const day = (d: Date) =>
  new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' }).format(d);

export function receiptMail(r: ReceiptInput): OutgoingMail {
  const amount = formatMoney(r.amountMinor, r.currency.toUpperCase(), 'en-GB');
  const lines = [
    `Amount: ${amount}`,
    `Paid on: ${day(r.paidAt)}`,
    ...(r.periodEnd ? [`Covers the month up to: ${day(r.periodEnd)}`] : []),
    ...(r.invoiceNumber ? [`Invoice number: ${r.invoiceNumber}`] : []),
  ];
  const mail = renderMail({
    subject: `Receipt: ${amount} coaching fee, ${r.teamName}`,
    preheader: `${amount} paid on ${day(r.paidAt)}.`,
    title: 'Payment received',
    blocks: [
      { type: 'paragraph', text: `Hello ${r.athleteName}, thank you: your coaching fee for ${r.teamName} is paid.` },
      { type: 'list', items: [{ title: r.planName ?? 'Coaching fee', lines }] },
      { type: 'button', label: 'See your fee', url: `${r.appOrigin}/my-fee` },
    ],
    footer: [
      {
        type: 'paragraph',
        text: 'You get this receipt because a coaching fee was paid for you. Card details stay with the payment provider; Rackturn never sees them.',
      },
    ],
  });
  return {
    kind: 'fee_receipt',
    dedupeKey: `fee-receipt:${r.invoiceId}`,
    teamId: r.teamId,
    to: r.to,
    subject: mail.subject,
    text: mail.text,
    html: mail.html,
  };
}

// A fee's payment status as icon and words (colour only repeats what they say).
import type { SVGProps } from 'react';
import type { PaymentStatus } from '../../../../shared/schemas';
import { BreakIcon, CleanIcon, iconFrame } from '../../../components/ui/icons';

const HourglassIcon = (p: SVGProps<SVGSVGElement>) => (
  <svg {...iconFrame} {...p}>
    <path
      d="M5 2.5h10M5 17.5h10M6 2.5c0 4 8 4 8 7.5s-8 3.5-8 7.5M14 2.5c0 4-8 4-8 7.5s8 3.5 8 7.5"
      strokeLinecap="round"
    />
  </svg>
);
const StoppedIcon = (p: SVGProps<SVGSVGElement>) => (
  <svg {...iconFrame} {...p}>
    <circle cx="10" cy="10" r="8" />
    <path d="M6 10h8" strokeLinecap="round" />
  </svg>
);
const EmptyIcon = (p: SVGProps<SVGSVGElement>) => (
  <svg {...iconFrame} {...p}>
    <circle cx="10" cy="10" r="8" strokeDasharray="3 3" />
  </svg>
);

export const STATUS_LABEL: Record<PaymentStatus, string> = {
  active: 'Active',
  past_due: 'Past due',
  pending: 'Pending',
  cancelled: 'Cancelled',
  none: 'No fee',
};

const LOOK: Record<PaymentStatus, { Icon: typeof CleanIcon; className: string }> = {
  active: { Icon: CleanIcon, className: 'border-clean-600/40 bg-clean-100 text-clean-700' },
  past_due: { Icon: BreakIcon, className: 'border-breach-600/40 bg-breach-100 text-breach-700' },
  pending: { Icon: HourglassIcon, className: 'border-caution-600/40 bg-caution-100 text-caution-700' },
  cancelled: { Icon: StoppedIcon, className: 'border-ink-300 bg-chalk-100 text-ink-700' },
  none: { Icon: EmptyIcon, className: 'border-ink-200 bg-chalk-50 text-ink-500' },
};

export function FeeStatus({ status, size = 'sm' }: { status: PaymentStatus; size?: 'sm' | 'lg' }) {
  const { Icon, className } = LOOK[status];
  return (
    <span
      data-status={status}
      className={`inline-flex items-center gap-1.5 whitespace-nowrap rounded-full border font-semibold ${className} ${
        size === 'lg' ? 'px-3 py-1 text-base' : 'px-2 py-0.5 text-sm'
      }`}
    >
      <Icon className={size === 'lg' ? 'h-5 w-5' : 'h-4 w-4'} />
      {STATUS_LABEL[status]}
    </span>
  );
}

/** Dates of fees are shown as a day, e.g. "14 Mar 2027"; none as a dash. */
export function feeDay(iso: string | null): string {
  if (!iso) return '—';
  return new Intl.DateTimeFormat(undefined, { day: 'numeric', month: 'short', year: 'numeric' }).format(new Date(iso));
}

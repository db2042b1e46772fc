// Page frame pieces: a heading row with actions, the training caution, notices and loading states.
import type { ReactNode } from 'react';
import { TRAINING_CAUTION_TEXT } from '../../../shared/labels';
import { WarningIcon } from './icons';

/** A skip link: hidden until it has the focus, then shown over the top left corner. */
export const SKIP_LINK_CLASS =
  'sr-only focus:not-sr-only focus:fixed focus:left-2 focus:top-2 focus:z-50 focus:rounded-md focus:bg-chalk-50 focus:px-3 focus:py-2 focus:font-semibold focus:text-ink-900 focus:shadow-lg';

export function PageHeader({ title, subtitle, actions }: { title: string; subtitle?: ReactNode; actions?: ReactNode }) {
  return (
    <div className="mb-4 flex flex-wrap items-end justify-between gap-3">
      <div>
        <h1 className="text-2xl font-bold tracking-tight text-ink-900 sm:text-3xl">{title}</h1>
        {subtitle ? <p className="mt-1 text-ink-600">{subtitle}</p> : null}
      </div>
      {actions ? <div className="flex flex-wrap gap-2">{actions}</div> : null}
    </div>
  );
}

/** Shown wherever training load is set or shown. */
export function TrainingCaution({ className = '' }: { className?: string }) {
  return (
    <aside
      aria-label="Training caution"
      className={`flex gap-2 rounded-md border border-caution-600/40 bg-caution-100 p-3 text-sm text-ink-800 ${className}`}
    >
      <WarningIcon className="mt-0.5 shrink-0 text-caution-700" />
      <p>{TRAINING_CAUTION_TEXT}</p>
    </aside>
  );
}

export function Notice({
  tone = 'info',
  children,
  title,
}: {
  tone?: 'info' | 'error' | 'success';
  children: ReactNode;
  title?: string;
}) {
  const tones = {
    info: 'border-ink-300 bg-chalk-50 text-ink-800',
    error: 'border-breach-600/50 bg-breach-100 text-breach-700',
    success: 'border-clean-600/50 bg-clean-100 text-clean-700',
  };
  return (
    <div role={tone === 'error' ? 'alert' : 'status'} className={`rounded-md border p-3 ${tones[tone]}`}>
      {title ? <p className="font-semibold">{title}</p> : null}
      <div>{children}</div>
    </div>
  );
}

export function Loading({ label = 'Loading…' }: { label?: string }) {
  return (
    <p role="status" className="p-6 text-ink-500">
      {label}
    </p>
  );
}

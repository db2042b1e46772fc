// One setting: its input on the left, and beside it one plain sentence saying what the current value does.
import type { ReactNode } from 'react';

export function RuleRow({
  children,
  effect,
  wide = false,
}: {
  children: ReactNode;
  effect: ReactNode;
  wide?: boolean;
}) {
  return (
    <div
      className={`grid gap-x-6 gap-y-1 border-t border-chalk-300 py-3 first:border-t-0 md:items-start ${
        wide ? 'md:grid-cols-[minmax(0,26rem)_1fr]' : 'md:grid-cols-[minmax(0,18rem)_1fr]'
      }`}
    >
      <div>{children}</div>
      <p className="text-ink-700 md:pt-7" aria-live="polite">
        {effect}
      </p>
    </div>
  );
}

export function RuleSection({
  title,
  intro,
  children,
  actions,
}: {
  title: string;
  intro?: ReactNode;
  children: ReactNode;
  actions?: ReactNode;
}) {
  return (
    <section className="rounded-lg border border-chalk-300 bg-chalk-50 p-4" aria-label={title}>
      <div className="mb-1 flex flex-wrap items-center justify-between gap-2">
        <h2 className="text-lg font-bold">{title}</h2>
        {actions}
      </div>
      {intro ? <p className="mb-2 text-sm text-ink-600">{intro}</p> : null}
      {children}
    </section>
  );
}

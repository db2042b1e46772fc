// A titled block of the Athlete page.
import type { ReactNode } from 'react';

export function Panel({
  title,
  children,
  actions,
  className = '',
}: {
  title: string;
  children: ReactNode;
  actions?: ReactNode;
  className?: string;
}) {
  return (
    <section aria-label={title} className={`rounded-lg border border-chalk-300 bg-chalk-50 p-4 ${className}`}>
      <div className="mb-3 flex flex-wrap items-center justify-between gap-2">
        <h2 className="text-lg font-bold">{title}</h2>
        {actions}
      </div>
      {children}
    </section>
  );
}

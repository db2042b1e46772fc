// The frame of the signed-out pages: the wordmark on ink blue and a chalk card.
import type { ReactNode } from 'react';

export function AuthFrame({ title, children }: { title: string; children: ReactNode }) {
  return (
    <main className="flex min-h-dvh flex-col items-center justify-center bg-ink-900 px-4 py-10">
      <p className="mb-6 flex items-center gap-2 text-3xl font-bold tracking-wide text-chalk-50">
        <span aria-hidden className="inline-block h-5 w-8 rounded-sm border-x-[6px] border-rust-500 bg-chalk-100" />
        Rackturn
      </p>
      <section className="w-full max-w-sm rounded-lg bg-chalk-50 p-6 shadow-lg">
        <h1 className="mb-4 text-2xl font-bold text-ink-900">{title}</h1>
        {children}
      </section>
      <p className="mt-6 max-w-sm text-center text-sm text-ink-300">
        Weekly max-effort rotation for coaches and their athletes.
      </p>
    </main>
  );
}

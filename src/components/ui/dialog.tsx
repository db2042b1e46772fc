// A modal dialog on the browser's own <dialog>: focus stays inside, Esc closes, the page behind is inert.
import { useEffect, useId, useRef, type ReactNode } from 'react';

export function Dialog({
  open,
  onClose,
  title,
  description,
  children,
  size = 'md',
}: {
  open: boolean;
  onClose: () => void;
  title: string;
  description?: ReactNode;
  children: ReactNode;
  size?: 'sm' | 'md' | 'lg' | 'xl';
}) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  useEffect(() => {
    const d = ref.current;
    if (!d) return;
    if (open && !d.open) d.showModal();
    if (!open && d.open) d.close();
  }, [open]);
  const widths = { sm: 'max-w-md', md: 'max-w-2xl', lg: 'max-w-4xl', xl: 'max-w-6xl' };
  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      onClose={onClose}
      className={`m-auto w-[calc(100%-1.5rem)] ${widths[size]} max-h-[calc(100dvh-2rem)] rounded-lg bg-chalk-50 p-0 text-ink-900 shadow-2xl backdrop:bg-ink-950/60`}
    >
      {open ? (
        <div className="flex max-h-[calc(100dvh-2rem)] flex-col">
          <header className="flex items-start justify-between gap-3 border-b border-chalk-300 px-5 py-3">
            <div>
              <h2 id={titleId} className="text-xl font-bold">
                {title}
              </h2>
              {description ? <p className="text-sm text-ink-600">{description}</p> : null}
            </div>
            <button
              type="button"
              onClick={onClose}
              aria-label="Close"
              className="min-h-11 min-w-11 rounded-md text-2xl leading-none text-ink-600 hover:bg-chalk-200"
            >
              ×
            </button>
          </header>
          <div className="overflow-y-auto px-5 py-4">{children}</div>
        </div>
      ) : null}
    </dialog>
  );
}

// A modal dialog on the native <dialog> element: focus stays inside, Escape closes, the page behind waits.
import { useEffect, useId, useRef, type ReactNode } from 'react';

export function Dialog({
  title,
  onClose,
  children,
  wide = false,
}: {
  title: string;
  onClose: () => void;
  children: ReactNode;
  wide?: boolean;
}) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  useEffect(() => {
    const d = ref.current;
    if (d && !d.open) d.showModal();
    return () => d?.close();
  }, []);
  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      onCancel={(e) => {
        e.preventDefault();
        onClose();
      }}
      className={`m-auto w-[calc(100%-2rem)] ${wide ? 'max-w-xl' : 'max-w-md'} rounded-lg bg-chalk-50 p-0 text-ink-900 shadow-2xl backdrop:bg-ink-950/60`}
    >
      <div className="p-5">
        <h2 id={titleId} className="mb-3 text-xl font-bold">
          {title}
        </h2>
        {children}
      </div>
    </dialog>
  );
}

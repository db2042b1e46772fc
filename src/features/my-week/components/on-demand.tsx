// A part of My week opened on demand (a log form, the check-in): a button opens it and the focus moves to
// its first field; Escape or its close button shuts it and gives the focus back to the button. Once
// opened it stays mounted while shut (only hidden), so what was typed is still there when it opens again.
import { useEffect, useId, useRef, useState, type KeyboardEvent, type ReactNode } from 'react';
import { Button, buttonClass } from '../../../components/ui/button';

const FIELD = 'input:not([type="hidden"]), select, textarea';

/** Focuses the panel's first field, waiting for it when the panel's code is still loading. */
function focusFirstField(panel: HTMLElement): () => void {
  const tryFocus = () => {
    const field = panel.querySelector<HTMLElement>(FIELD);
    if (!field) return false;
    field.focus();
    return true;
  };
  if (tryFocus()) return () => undefined;
  const watch = new MutationObserver(() => {
    if (tryFocus()) watch.disconnect();
  });
  watch.observe(panel, { childList: true, subtree: true });
  return () => watch.disconnect();
}

export function OnDemand({
  openLabel,
  closeLabel,
  primary = false,
  children,
}: {
  /** The opening button's words, e.g. "Log the top set". */
  openLabel: string;
  /** The close button's words, e.g. "Close the log form". */
  closeLabel: string;
  /** The page's main action (the top set) uses the rust button; the rest the quieter one. */
  primary?: boolean;
  children: ReactNode;
}) {
  const [open, setOpen] = useState(false);
  const [mounted, setMounted] = useState(false);
  const id = useId();
  const opener = useRef<HTMLButtonElement>(null);
  const panel = useRef<HTMLDivElement>(null);

  useEffect(() => {
    if (!open || !panel.current) return;
    return focusFirstField(panel.current);
  }, [open]);

  const close = () => {
    setOpen(false);
    opener.current?.focus();
  };
  const onKeyDown = (e: KeyboardEvent) => {
    if (e.key !== 'Escape') return;
    e.stopPropagation();
    close();
  };

  return (
    <div className="flex flex-col gap-3">
      <button
        ref={opener}
        type="button"
        aria-expanded={open}
        aria-controls={id}
        onClick={() => {
          if (open) return close();
          setMounted(true);
          setOpen(true);
        }}
        className={buttonClass(primary && !open ? 'primary' : 'secondary', 'md', 'self-stretch sm:self-start')}
      >
        {open ? closeLabel : openLabel}
      </button>
      <div ref={panel} id={id} hidden={!open} onKeyDown={onKeyDown} className="flex flex-col gap-3">
        {mounted ? children : null}
        {open ? (
          <Button variant="ghost" onClick={close} className="self-stretch sm:self-start">
            {closeLabel}
          </Button>
        ) : null}
      </div>
    </div>
  );
}

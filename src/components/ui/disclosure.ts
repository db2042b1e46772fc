// A disclosure (a button that shows a panel below it): Escape or a click elsewhere closes it, and the
// focus returns to the button.
import { useEffect, useId, useRef, useState, type KeyboardEvent } from 'react';

export function useDisclosure() {
  const [open, setOpen] = useState(false);
  const id = useId();
  const root = useRef<HTMLDivElement>(null);
  const button = useRef<HTMLButtonElement>(null);

  useEffect(() => {
    if (!open) return;
    const onPointer = (e: PointerEvent) => {
      if (!root.current?.contains(e.target as Node)) setOpen(false);
    };
    document.addEventListener('pointerdown', onPointer);
    return () => document.removeEventListener('pointerdown', onPointer);
  }, [open]);

  const close = () => {
    setOpen(false);
    button.current?.focus();
  };
  const onKeyDown = (e: KeyboardEvent) => {
    if (e.key === 'Escape' && open) close();
  };
  return { open, setOpen, id, root, button, onKeyDown };
}

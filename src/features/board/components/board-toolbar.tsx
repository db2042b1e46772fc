// The board's actions: plan with the engine, undo, and room for further week actions (publishing).
import type { ReactNode } from 'react';
import { Button } from '../../../components/ui/button';

export function BoardToolbar({
  busy,
  onFill,
  onPlanToMeet,
  onReshuffle,
  undoLabel,
  undoCount,
  onUndo,
  libraryOpen,
  onToggleLibrary,
  extra,
  readOnly = false,
}: {
  /** On a phone: no planning from here, only a word on why. */
  readOnly?: boolean;
  busy: 'fill' | 'meet' | 'reshuffle' | null;
  onFill: () => void;
  onPlanToMeet: () => void;
  onReshuffle: () => void;
  undoLabel: string | null;
  undoCount: number;
  onUndo: () => void;
  libraryOpen: boolean;
  onToggleLibrary: () => void;
  /** Further actions for the planned weeks (such as publishing a week) go here, after the planning ones. */
  extra?: ReactNode;
}) {
  if (readOnly) {
    return (
      <p className="mb-3 rounded-md border border-ink-200 bg-chalk-50 p-3 text-sm text-ink-800">
        On a phone the board is read-only: tap a pick to see it and its reasons. Plan and publish on a tablet or a
        computer.
      </p>
    );
  }
  return (
    <div aria-label="Board actions" role="group" className="mb-3 flex flex-wrap items-center gap-2">
      <Button onClick={onFill} disabled={busy !== null}>
        {busy === 'fill' ? 'Filling…' : 'Fill next week'}
      </Button>
      <Button variant="secondary" onClick={onPlanToMeet} disabled={busy !== null}>
        {busy === 'meet' ? 'Planning…' : 'Plan to meet'}
      </Button>
      <Button variant="secondary" onClick={onReshuffle} disabled={busy !== null}>
        {busy === 'reshuffle' ? 'Reshuffling…' : 'Reshuffle'}
      </Button>
      <Button
        variant="ghost"
        onClick={onUndo}
        disabled={!undoLabel}
        title={undoLabel ? `Undo: ${undoLabel} (Ctrl+Z)` : 'Nothing to undo'}
        aria-describedby="board-undo-what"
      >
        Undo{undoCount ? ` (${undoCount})` : ''}
      </Button>
      <span id="board-undo-what" className="sr-only">
        {undoLabel ? `Undoes: ${undoLabel}` : 'Nothing to undo'}
      </span>
      <div data-slot="week-actions" className="flex flex-wrap items-center gap-2">
        {extra}
      </div>
      <Button variant="ghost" className="ml-auto" onClick={onToggleLibrary} aria-expanded={libraryOpen}>
        {libraryOpen ? 'Hide library' : 'Show library'}
      </Button>
    </div>
  );
}

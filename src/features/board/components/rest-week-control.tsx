// An athlete's week on the board as a rest (deload) week: a band that reads "Rest week" over the week's
// slots, and for weeks still to come a small button that marks or unmarks it. The planner leaves a rest
// week's max-effort slots empty.
import type { BoardAthlete } from '../../../../shared/schemas';
import { useRestWeek } from '../api/use-rest-week';

export function RestWeekControl({
  athlete,
  week,
  editable,
}: {
  athlete: BoardAthlete;
  week: string;
  editable: boolean;
}) {
  const save = useRestWeek();
  const rest = athlete.restWeeks.includes(week);
  const toggle = () => save.mutate({ athleteId: athlete.id, week, rest: !rest });
  const error = save.error ? (
    <span role="alert" className="block text-[11px] text-breach-700">
      {save.error.message}
    </span>
  ) : null;
  if (rest) {
    return (
      <div
        className="flex items-center justify-between gap-1 rounded border border-dashed border-ink-400 bg-chalk-200 px-1.5 py-0.5 text-xs font-semibold text-ink-800"
        data-rest-week={week}
      >
        <span>Rest week · no max-effort work</span>
        {editable ? (
          <button
            type="button"
            className="min-h-6 rounded px-1 text-[11px] font-semibold text-ink-700 underline underline-offset-2 hover:text-rust-600 disabled:opacity-50"
            aria-label={`${athlete.name} · ${week}: back to a training week`}
            disabled={save.isPending}
            onClick={toggle}
          >
            Undo
          </button>
        ) : null}
        {error}
      </div>
    );
  }
  if (!editable) return null;
  // Shown while the pointer is over the week or the button has focus, so forty rows do not all say it.
  return (
    <div className="text-right">
      <button
        type="button"
        className="min-h-6 rounded px-1 text-[11px] font-semibold text-ink-600 opacity-0 hover:text-rust-600 focus:opacity-100 disabled:opacity-40 [td:hover_&]:opacity-100"
        aria-label={`${athlete.name} · ${week}: make it a rest week`}
        disabled={save.isPending}
        onClick={toggle}
      >
        Rest week?
      </button>
      {error}
    </div>
  );
}

// Shown when another coach saved a cell first: what is there now, what was not saved, and a way to put
// this coach's change back on top. Nothing is dropped without saying so.
import { Button } from '../../../components/ui/button';
import { WarningIcon } from '../../../components/ui/icons';

export interface ConflictView {
  label: string;
  cells: { cell: string; theirs: string; by: string | null; mine: string }[];
}

export function ConflictNotice({
  conflict,
  busy,
  onReapply,
  onDismiss,
}: {
  conflict: ConflictView;
  busy: boolean;
  onReapply: () => void;
  onDismiss: () => void;
}) {
  return (
    <div role="alert" className="mb-3 rounded-md border border-caution-600/50 bg-caution-100 p-3 text-sm text-ink-900">
      <p className="flex items-center gap-1 font-semibold text-caution-700">
        <WarningIcon /> Someone else changed this first — your change was not saved
      </p>
      <ul className="mt-1 list-disc pl-5">
        {conflict.cells.map((c) => (
          <li key={c.cell}>
            {c.cell}: now <strong>{c.theirs}</strong>
            {c.by ? ` (saved by ${c.by})` : ''}; yours was <strong>{c.mine}</strong>.
          </li>
        ))}
      </ul>
      <div className="mt-2 flex flex-wrap gap-2">
        <Button size="sm" onClick={onReapply} disabled={busy}>
          Apply my change again
        </Button>
        <Button size="sm" variant="secondary" onClick={onDismiss}>
          Keep theirs
        </Button>
      </div>
    </div>
  );
}

// Asked when a drop breaks a rule: the rules it breaks, and why the coach keeps it anyway. The pick is
// then saved as a pinned coach pick with that reason.
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { reasonField } from '../../../../shared/schemas';
import { Button } from '../../../components/ui/button';
import { TextAreaField } from '../../../components/ui/field';
import { BreakIcon } from '../../../components/ui/icons';
import { Dialog } from '../../../components/ui/dialog';

const reasonForm = z.object({ reason: reasonField });
type ReasonForm = z.infer<typeof reasonForm>;

export interface ReasonAsk {
  /** What is being saved, as the coach reads it. */
  label: string;
  /** Per cell that breaks a rule: its label and the rules it breaks. */
  breaks: { cell: string; rules: string[] }[];
  /** A reason the server refused, to show next to the field. */
  serverError?: string | undefined;
}

export function ReasonDialog({
  ask,
  saving,
  onSubmit,
  onCancel,
}: {
  ask: ReasonAsk;
  saving: boolean;
  onSubmit: (reason: string) => void;
  onCancel: () => void;
}) {
  const form = useForm<ReasonForm>({ resolver: zodResolver(reasonForm), defaultValues: { reason: '' } });
  const submit = form.handleSubmit((v) => onSubmit(v.reason));
  const error = form.formState.errors.reason?.message ?? ask.serverError;
  return (
    <Dialog open title="This pick breaks a rule" onClose={onCancel} size="md">
      <p className="text-ink-700">{ask.label}</p>
      <ul className="my-3 space-y-2">
        {ask.breaks.map((b) => (
          <li key={b.cell} className="rounded-md border border-breach-600/40 bg-breach-100 p-2 text-sm">
            <p className="flex items-center gap-1 font-semibold text-breach-700">
              <BreakIcon width={16} height={16} />
              {b.cell}
            </p>
            <ul className="mt-1 list-disc pl-5 text-ink-800">
              {b.rules.map((r) => (
                <li key={r}>{r}</li>
              ))}
            </ul>
          </li>
        ))}
      </ul>
      <form onSubmit={submit} noValidate className="flex flex-col gap-3">
        <TextAreaField
          label="Why keep it anyway?"
          rows={3}
          autoFocus
          hint="Saved with the pick, which is then kept as it is when the engine plans."
          error={error}
          {...form.register('reason')}
        />
        <div className="flex flex-wrap justify-end gap-2">
          <Button variant="secondary" onClick={onCancel}>
            Cancel
          </Button>
          <Button type="submit" disabled={saving}>
            {saving ? 'Saving…' : 'Save as coach pick'}
          </Button>
        </div>
      </form>
    </Dialog>
  );
}

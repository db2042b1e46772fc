// One meet: when and where, who is entered (with class, division and attempts), and entering more athletes.
import { useState } from 'react';
import type { Athlete, Meet } from '../../../../shared/schemas';
import { Link } from 'react-router-dom';
import { Button, buttonClass } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { SelectField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/page';
import { useDeleteMeet } from '../api/use-save-meet';
import { useAddEntry } from '../api/use-save-entry';
import { EntryCard } from './entry-card';
import { MeetForm } from './meet-form';
import { dateText, meetWhen } from './when';

/** `athletes` is the team's roster, offered for entering; the page reads it. */
export function MeetDetail({ meet, athletes, onDeleted }: { meet: Meet; athletes: Athlete[]; onDeleted: () => void }) {
  const [editing, setEditing] = useState(false);
  const [confirmDelete, setConfirmDelete] = useState(false);
  const [notice, setNotice] = useState<string | null>(null);
  const [athleteId, setAthleteId] = useState('');
  const add = useAddEntry(meet.id);
  const remove = useDeleteMeet();
  const entered = new Set(meet.entries.map((e) => e.athlete.id));
  const free = athletes.filter((a) => !entered.has(a.id));

  return (
    <section aria-label={meet.name} className="flex flex-col gap-4">
      <div className="flex flex-wrap items-start justify-between gap-3 rounded-lg border border-chalk-300 bg-chalk-50 p-4">
        <div>
          <h2 className="text-2xl font-bold">{meet.name}</h2>
          <p className="text-ink-700">
            {dateText(meet.date)} · {meetWhen(meet.date)}
            {meet.location ? ` · ${meet.location}` : ''}
            {meet.federation ? ` · ${meet.federation}` : ''}
          </p>
          {meet.notes ? <p className="mt-1 text-sm text-ink-600">{meet.notes}</p> : null}
        </div>
        <div className="flex flex-wrap gap-2">
          <Link to={`/meets/${meet.id}/day`} className={buttonClass('primary', 'sm')}>
            Open meet day
          </Link>
          <Link to={`/meets/${meet.id}/sheet`} className={buttonClass('ghost', 'sm')}>
            Result sheet
          </Link>
          <Button variant="secondary" size="sm" onClick={() => setEditing(true)}>
            Edit meet
          </Button>
          {confirmDelete ? (
            <Button variant="danger" size="sm" onClick={() => remove.mutate(meet.id, { onSuccess: onDeleted })}>
              Confirm delete
            </Button>
          ) : (
            <Button variant="ghost" size="sm" onClick={() => setConfirmDelete(true)}>
              Delete meet
            </Button>
          )}
        </div>
      </div>
      {notice ? <Notice tone="error">{notice}</Notice> : null}
      {remove.error ? <Notice tone="error">{remove.error.message}</Notice> : null}

      <form
        className="flex flex-wrap items-end gap-2"
        aria-label="Enter an athlete"
        onSubmit={(e) => {
          e.preventDefault();
          if (!athleteId) return;
          add.mutate({ athleteId: Number(athleteId) }, { onSuccess: () => setAthleteId('') });
        }}
      >
        <div className="min-w-64 grow sm:grow-0">
          <SelectField
            label="Enter an athlete"
            value={athleteId}
            onChange={(e) => setAthleteId(e.target.value)}
            error={add.error?.message}
          >
            <option value="">Choose an athlete…</option>
            {free.map((a) => (
              <option key={a.id} value={a.id}>
                {a.name}
              </option>
            ))}
          </SelectField>
        </div>
        <Button type="submit" disabled={!athleteId || add.isPending}>
          Enter
        </Button>
      </form>

      {meet.entries.length === 0 ? (
        <p className="text-ink-600">Nobody is entered yet.</p>
      ) : (
        <div className="flex flex-col gap-3">
          {meet.entries.map((e) => (
            <EntryCard key={`${e.id}-${e.version}`} entry={e} meetId={meet.id} />
          ))}
        </div>
      )}

      <Dialog open={editing} onClose={() => setEditing(false)} title={`Edit ${meet.name}`}>
        <MeetForm
          meet={meet}
          onSaved={(_m, conflict) => {
            setEditing(false);
            setNotice(conflict ?? null);
          }}
        />
      </Dialog>
    </section>
  );
}

// "Publish week": checks first (empty cells, rule breaks without a reason, athletes without an account, who
// would get an e-mail), then the coach publishes anyway or goes back. Publishing again after changes sends
// an update naming what changed; with nothing new, nothing is sent.
import { useQuery } from '@tanstack/react-query';
import { useId, useState } from 'react';
import { addWeeks, weekOfDate } from '../../../../shared/engine/weeks';
import type { PublishCheck, PublishResult } from '../../../../shared/schemas';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { BreakIcon, CleanIcon, WarningIcon } from '../../../components/ui/icons';
import { publicationQueryOptions, publishCheckQueryOptions } from '../api/queries';
import { useInviteAthlete } from '../api/use-invite-athlete';
import { usePublishWeek } from '../api/use-publish-week';

const when = new Intl.DateTimeFormat(undefined, { day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit' });

function CheckList({
  title,
  count,
  tone,
  children,
}: {
  title: string;
  count: number;
  tone: 'ok' | 'caution' | 'breach';
  children: React.ReactNode;
}) {
  const Icon = count === 0 ? CleanIcon : tone === 'breach' ? BreakIcon : WarningIcon;
  const text = count === 0 ? 'text-clean-700' : tone === 'breach' ? 'text-breach-700' : 'text-caution-700';
  return (
    <section className="mt-3" aria-label={title}>
      <h3 className={`flex items-center gap-1 font-semibold ${text}`}>
        <Icon width={15} height={15} /> {title}: {count}
      </h3>
      {count ? (
        // A long list scrolls inside the dialog: focusable, so a keyboard can scroll it too.
        <ul
          tabIndex={0}
          aria-label={title}
          className="mt-1 max-h-40 list-disc space-y-0.5 overflow-y-auto pl-6 text-sm focus-visible:outline-2 focus-visible:outline-ink-800"
        >
          {children}
        </ul>
      ) : null}
    </section>
  );
}

/**
 * An athlete without an account, with one button: it sends the invitation at once when the roster has
 * their e-mail; otherwise it opens the invitation form for that athlete right here, asking only for it.
 */
function InviteLine({
  athleteId,
  athleteName,
  email: onFile,
}: {
  athleteId: number;
  athleteName: string;
  email: string | null;
}) {
  const invite = useInviteAthlete();
  const [email, setEmail] = useState(onFile ?? '');
  const [editing, setEditing] = useState(false);
  const id = useId();
  if (invite.isSuccess)
    return (
      <li role="status">
        {athleteName}: invitation sent to {invite.data.email}.
      </li>
    );
  if (!editing && !invite.isError)
    return (
      <li className="flex flex-wrap items-center gap-2">
        <span>
          {athleteName}
          {onFile ? ` (${onFile})` : ''}
        </span>
        <Button
          size="sm"
          variant="secondary"
          disabled={invite.isPending}
          onClick={() => (onFile ? invite.mutate({ athleteId, email: onFile }) : setEditing(true))}
        >
          {invite.isPending ? 'Inviting…' : `Invite ${athleteName}`}
        </Button>
      </li>
    );
  return (
    <li>
      <form
        aria-label={`Invite ${athleteName}`}
        className="flex flex-wrap items-center gap-2"
        onSubmit={(e) => {
          e.preventDefault();
          invite.mutate({ athleteId, email });
        }}
      >
        <label htmlFor={id}>{athleteName}: e-mail</label>
        <input
          id={id}
          type="email"
          required
          autoFocus
          value={email}
          onChange={(e) => setEmail(e.target.value)}
          aria-invalid={invite.isError || undefined}
          aria-describedby={invite.isError ? `${id}-error` : undefined}
          className="min-h-9 rounded-md border border-ink-300 bg-chalk-50 px-2 text-ink-900"
        />
        <Button type="submit" size="sm" variant="secondary" disabled={invite.isPending}>
          Send invitation
        </Button>
        {invite.isError ? (
          <span id={`${id}-error`} role="alert" className="text-sm text-breach-700">
            {invite.error.message}
          </span>
        ) : null}
      </form>
    </li>
  );
}

function CheckView({ check }: { check: PublishCheck }) {
  return (
    <>
      <CheckList title="Empty cells" count={check.emptyCells.count} tone="caution">
        {check.emptyCells.items.map((c) => (
          <li key={`${c.athleteId}${c.slotId}`}>
            {c.athleteName}: {c.slotLabel} is empty (no e-mail says “nothing this week”)
          </li>
        ))}
      </CheckList>
      <CheckList title="Rule breaks without a reason" count={check.unexplainedBreaks.count} tone="breach">
        {check.unexplainedBreaks.items.map((c) => (
          <li key={`${c.athleteId}${c.slotId}`}>
            {c.athleteName}, {c.slotLabel}: {c.variantName} — {c.messages[0]}
          </li>
        ))}
      </CheckList>
      <CheckList title="Athletes without an account" count={check.withoutAccount.count} tone="caution">
        {check.withoutAccount.items.map((a) => (
          <InviteLine key={a.athleteId} athleteId={a.athleteId} athleteName={a.athleteName} email={a.email} />
        ))}
      </CheckList>
      <CheckList title="E-mails to send" count={check.wouldEmail.count} tone="ok">
        {check.wouldEmail.items.map((m) => (
          <li key={m.athleteId}>
            {m.athleteName} ({m.email}): {m.kind === 'plan' ? 'the week’s plan' : `an update — ${m.changes.join('; ')}`}
          </li>
        ))}
      </CheckList>
    </>
  );
}

function PublishDialog({ week, onClose }: { week: string; onClose: () => void }) {
  const check = useQuery(publishCheckQueryOptions(week));
  const publish = usePublishWeek();
  const [done, setDone] = useState<PublishResult | null>(null);
  const c = check.data;
  const problems = c ? c.emptyCells.count + c.unexplainedBreaks.count + c.withoutAccount.count : 0;
  return (
    <Dialog
      open
      size="md"
      title={`Publish ${week}`}
      description="Athletes see a week only once it is published."
      onClose={onClose}
    >
      {done ? (
        <p role="status" className="text-ink-900">
          {done.athletesPublished
            ? `Published for ${done.athletesPublished} athlete${done.athletesPublished === 1 ? '' : 's'}; ${done.emailsQueued} e-mail${done.emailsQueued === 1 ? '' : 's'} on the way.`
            : 'Nothing had changed since the last publication: nothing was sent.'}
        </p>
      ) : check.isPending ? (
        <p className="text-ink-700">Checking the week…</p>
      ) : check.isError ? (
        <p role="alert" className="text-breach-700">
          {check.error.message}
        </p>
      ) : c ? (
        <>
          <p className="text-ink-900">
            {problems === 0
              ? 'Everything is in place.'
              : 'Some things are missing. You can publish anyway or go back to the board.'}
          </p>
          <CheckView check={c} />
        </>
      ) : null}
      {publish.error ? (
        <p role="alert" className="mt-2 text-sm font-medium text-breach-700">
          {publish.error.message}
        </p>
      ) : null}
      <div className="mt-4 flex justify-end gap-2">
        {done ? (
          <Button onClick={onClose}>Close</Button>
        ) : (
          <>
            <Button variant="secondary" onClick={onClose}>
              Go back
            </Button>
            <Button
              disabled={!c || publish.isPending}
              onClick={() => publish.mutate(week, { onSuccess: (r) => setDone(r) })}
            >
              {publish.isPending ? 'Publishing…' : problems ? 'Publish anyway' : 'Publish'}
            </Button>
          </>
        )}
      </div>
    </Dialog>
  );
}

export function PublishWeekButton({ week: fixedWeek }: { week?: string }) {
  const thisWeek = weekOfDate(new Date());
  const [chosen, setChosen] = useState(addWeeks(thisWeek, 1));
  const week = fixedWeek ?? chosen;
  const [open, setOpen] = useState(false);
  const publication = useQuery(publicationQueryOptions(week));
  const selectId = useId();
  const status = publication.data;

  return (
    <div className="flex flex-wrap items-center gap-2" role="group" aria-label="Publish week">
      {fixedWeek ? null : (
        <>
          <label htmlFor={selectId} className="sr-only">
            Week to publish
          </label>
          <select
            id={selectId}
            value={chosen}
            onChange={(e) => setChosen(e.target.value)}
            className="min-h-11 rounded-md border border-ink-300 bg-chalk-50 px-2 text-ink-900"
          >
            <option value={thisWeek}>This week ({thisWeek})</option>
            <option value={addWeeks(thisWeek, 1)}>Next week ({addWeeks(thisWeek, 1)})</option>
          </select>
        </>
      )}
      {status?.published ? (
        <p className="inline-flex items-center gap-1 text-sm text-ink-700">
          <CleanIcon className="text-clean-600" />
          Published {status.publishedAt ? when.format(new Date(status.publishedAt)) : ''}
          {status.publishedByName ? ` by ${status.publishedByName}` : ''} · {status.sent} sent
          {status.queued ? `, ${status.queued} waiting` : ''}
        </p>
      ) : null}
      <Button variant="secondary" disabled={publication.isPending} onClick={() => setOpen(true)}>
        {status?.published ? 'Publish changes' : 'Publish week'}
      </Button>
      {open ? <PublishDialog week={week} onClose={() => setOpen(false)} /> : null}
    </div>
  );
}

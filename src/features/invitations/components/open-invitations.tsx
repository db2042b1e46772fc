// Invitations not yet accepted: waiting or expired, each with resend and withdraw.
import { useQuery } from '@tanstack/react-query';
import type { Invitation } from '../../../../shared/schemas';
import { Button } from '../../../components/ui/button';
import { CleanIcon, WarningIcon } from '../../../components/ui/icons';
import { Loading, Notice } from '../../../components/ui/page';
import { invitationsQueryOptions } from '../api/queries';
import { useResendInvitation } from '../api/use-resend-invitation';
import { useRevokeInvitation } from '../api/use-revoke-invitation';

const day = new Intl.DateTimeFormat(undefined, { day: 'numeric', month: 'short' });

function Status({ invitation }: { invitation: Invitation }) {
  if (invitation.status === 'expired')
    return (
      <span className="inline-flex items-center gap-1 font-medium text-caution-700">
        <WarningIcon /> Expired
      </span>
    );
  return (
    <span className="inline-flex items-center gap-1 text-ink-700">
      <CleanIcon className="text-clean-600" /> Open until {day.format(new Date(invitation.expiresAt))}
    </span>
  );
}

export function OpenInvitations() {
  const list = useQuery(invitationsQueryOptions());
  const resend = useResendInvitation();
  const revoke = useRevokeInvitation();
  if (list.isPending) return <Loading label="Loading invitations…" />;
  if (list.isError) return <Notice tone="error">{list.error.message}</Notice>;
  if (list.data.items.length === 0) return <p className="text-ink-600">No open invitations.</p>;
  const busy = (id: number) =>
    (resend.isPending && resend.variables === id) || (revoke.isPending && revoke.variables === id);
  return (
    <div className="flex flex-col gap-2">
      {resend.isSuccess ? (
        <Notice tone="success">Sent again to {resend.data.email}; the earlier link no longer works.</Notice>
      ) : null}
      {resend.error || revoke.error ? <Notice tone="error">{(resend.error ?? revoke.error)!.message}</Notice> : null}
      <ul aria-label="Open invitations" className="divide-y divide-chalk-300 rounded-md border border-chalk-300">
        {list.data.items.map((inv) => (
          <li key={inv.id} className="flex flex-wrap items-center gap-x-4 gap-y-2 px-3 py-2">
            <div className="min-w-48 flex-1">
              <p className="break-all font-semibold text-ink-900">{inv.email}</p>
              <p className="text-sm text-ink-600">
                {inv.role === 'coach' ? 'Coach' : `Athlete${inv.athleteName ? ` · ${inv.athleteName}` : ''}`}
                {inv.invitedByName ? ` · invited by ${inv.invitedByName}` : ''}
              </p>
            </div>
            <Status invitation={inv} />
            <div className="flex gap-2">
              <Button
                variant="secondary"
                size="sm"
                disabled={busy(inv.id)}
                onClick={() => resend.mutate(inv.id)}
                aria-label={`Resend the invitation to ${inv.email}`}
              >
                Resend
              </Button>
              <Button
                variant="ghost"
                size="sm"
                disabled={busy(inv.id)}
                onClick={() => revoke.mutate(inv.id)}
                aria-label={`Withdraw the invitation to ${inv.email}`}
              >
                Withdraw
              </Button>
            </div>
          </li>
        ))}
      </ul>
      {list.data.total > list.data.items.length ? (
        <p className="text-sm text-ink-600">
          Showing {list.data.items.length} of {list.data.total}.
        </p>
      ) : null}
    </div>
  );
}

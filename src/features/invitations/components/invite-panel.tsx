// The Roster page's invitations panel, for the head coach only: invite by e-mail, and the open invitations.
import { useMe } from '../../../lib/me';
import { InviteForm } from './invite-form';
import { OpenInvitations } from './open-invitations';

export function InvitePanel() {
  const { data: me } = useMe();
  if (me?.role !== 'head_coach') return null;
  return (
    <section
      aria-labelledby="invite-panel-title"
      className="my-6 rounded-lg border border-chalk-300 bg-chalk-50 p-4 shadow-sm"
    >
      <h2 id="invite-panel-title" className="text-xl font-bold text-ink-900">
        Invitations
      </h2>
      <p className="mb-4 text-ink-600">
        Bring coaches and athletes in by e-mail. Each link works once, for 7 days; sending again replaces it.
      </p>
      <InviteForm />
      <h3 className="mb-2 mt-6 text-lg font-semibold text-ink-900">Open invitations</h3>
      <OpenInvitations />
    </section>
  );
}

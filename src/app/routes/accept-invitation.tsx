// Accept invitation: the link from the e-mail names the team and role; a used, withdrawn or expired
// link gets a page that says which, and what to do next.
import { useQuery } from '@tanstack/react-query';
import { Link, useSearchParams } from 'react-router-dom';
import { Loading, Notice } from '../../components/ui/page';
import { AuthFrame } from '../../features/auth/components/auth-frame';
import { invitationPreviewQueryOptions } from '../../features/invitations/api/queries';
import { AcceptInvitationForm } from '../../features/invitations/components/accept-invitation-form';
import { isApiError } from '../../lib/api-client';
import type { LoaderMaker } from '../guards';

export const makeLoader: LoaderMaker =
  (queryClient) =>
  async ({ request }) => {
    const token = new URL(request.url).searchParams.get('token');
    // A bad link is shown by the page itself, not the error screen.
    if (token) await queryClient.ensureQueryData(invitationPreviewQueryOptions(token)).catch(() => undefined);
    return null;
  };

const DEAD_TITLES: Record<string, string> = {
  invitation_used: 'Invitation already used',
  invitation_expired: 'Invitation expired',
  invitation_revoked: 'Invitation withdrawn',
};

function DeadLink({ code, message }: { code: string; message: string }) {
  return (
    <AuthFrame title={DEAD_TITLES[code] ?? 'Invitation not found'}>
      <div className="flex flex-col gap-4">
        <Notice tone="error">{message}</Notice>
        <Link to="/sign-in" className="text-center font-semibold text-ink-800 underline underline-offset-2">
          Go to sign in
        </Link>
      </div>
    </AuthFrame>
  );
}

export function Component() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const preview = useQuery({ ...invitationPreviewQueryOptions(token), enabled: token !== '' });
  if (!token)
    return (
      <DeadLink code="" message="This page needs the link from the invitation e-mail. Open it again from there." />
    );
  if (preview.isPending) return <Loading label="Checking the invitation…" />;
  if (preview.isError)
    return <DeadLink code={isApiError(preview.error) ? preview.error.code : ''} message={preview.error.message} />;
  return (
    <AuthFrame title="Accept invitation">
      <AcceptInvitationForm token={token} preview={preview.data} />
    </AuthFrame>
  );
}

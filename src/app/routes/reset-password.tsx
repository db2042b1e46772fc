// Reset password from the e-mail's link; then signed in to the role's start page, or to sign in.
import { useNavigate, useSearchParams } from 'react-router-dom';
import { resetLinkQueryOptions } from '../../features/auth/api/reset-link';
import { ResetPassword } from '../../features/auth/components/reset-password-form';
import { homeFor, type LoaderMaker } from '../guards';

export const makeLoader: LoaderMaker =
  (queryClient) =>
  async ({ request }) => {
    const token = new URL(request.url).searchParams.get('token');
    // A bad link is shown by the page itself, not the error screen.
    if (token) await queryClient.ensureQueryData(resetLinkQueryOptions(token)).catch(() => undefined);
    return null;
  };

export function Component() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  return (
    <ResetPassword
      token={params.get('token') ?? ''}
      onReset={(me) => navigate(me ? homeFor(me) : '/sign-in', { replace: true })}
    />
  );
}

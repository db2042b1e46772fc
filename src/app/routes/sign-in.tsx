// Sign in; then on to the page asked for, or the role's start page.
import { useNavigate, useSearchParams } from 'react-router-dom';
import { useForgetPreviousUser } from '../../features/auth/api/use-sign-out';
import { AuthFrame } from '../../features/auth/components/auth-frame';
import { SignInForm } from '../../features/auth/components/sign-in-form';
import { homeFor } from '../guards';

export function Component() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  useForgetPreviousUser();
  return (
    <AuthFrame title="Sign in">
      <SignInForm
        onSignedIn={(me) => {
          const next = params.get('next');
          navigate(next && next.startsWith('/') && !next.startsWith('//') ? next : homeFor(me), { replace: true });
        }}
      />
    </AuthFrame>
  );
}

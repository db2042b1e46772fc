// Reset password: the link from the e-mail is checked first; a used or expired link says so plainly.
import { zodResolver } from '@hookform/resolvers/zod';
import { useQuery, useQueryClient } from '@tanstack/react-query';
import { useForm } from 'react-hook-form';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { resetPasswordBody, type ResetPasswordBody } from '../../../shared/schemas';
import { Button } from '../../components/ui/button';
import { TextField } from '../../components/ui/field';
import { Loading, Notice } from '../../components/ui/page';
import { meQueryOptions } from '../../lib/me';
import { AuthFrame } from '../../features/auth/components/auth-frame';
import { resetLinkQueryOptions } from '../../features/password-reset/api/queries';
import { useResetPassword } from '../../features/password-reset/api/use-reset-password';
import { applyFieldErrors } from '../../lib/form-errors';
import { homeFor, type LoaderMaker } from '../guards';

export const makeLoader: LoaderMaker =
  (queryClient) =>
  async ({ request }) => {
    const token = new URL(request.url).searchParams.get('token');
    // A bad link is shown by the page itself, not the error screen.
    if (token) await queryClient.ensureQueryData(resetLinkQueryOptions(token)).catch(() => undefined);
    return null;
  };

function DeadLink({ message }: { message: string }) {
  return (
    <AuthFrame title="This link cannot be used">
      <div className="flex flex-col gap-4">
        <Notice tone="error">{message}</Notice>
        <Link to="/forgot-password" className="text-center font-semibold text-ink-800 underline underline-offset-2">
          Ask for a new link
        </Link>
      </div>
    </AuthFrame>
  );
}

function ResetForm({ token }: { token: string }) {
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const reset = useResetPassword();
  const form = useForm<ResetPasswordBody>({
    resolver: zodResolver(resetPasswordBody),
    defaultValues: { token, password: '', confirmPassword: '' },
  });
  const { errors, isSubmitting } = form.formState;

  const onSubmit = form.handleSubmit(async (values) => {
    try {
      const done = await reset.mutateAsync(values);
      if (!done.signedIn) return navigate('/sign-in', { replace: true });
      navigate(homeFor(await queryClient.fetchQuery(meQueryOptions())), { replace: true });
    } catch (err) {
      applyFieldErrors(err, form.setError);
    }
  });

  return (
    <AuthFrame title="Choose a new password">
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
        {reset.error && !Object.keys(errors).length ? <Notice tone="error">{reset.error.message}</Notice> : null}
        {errors.token ? <Notice tone="error">{errors.token.message}</Notice> : null}
        <TextField
          label="New password"
          type="password"
          autoComplete="new-password"
          hint="At least 10 characters."
          error={errors.password?.message}
          {...form.register('password')}
        />
        <TextField
          label="New password again"
          type="password"
          autoComplete="new-password"
          error={errors.confirmPassword?.message}
          {...form.register('confirmPassword')}
        />
        <p className="text-sm text-ink-600">Saving it signs you out on every other device.</p>
        <Button type="submit" size="lg" disabled={isSubmitting}>
          {isSubmitting ? 'Saving…' : 'Save and sign in'}
        </Button>
      </form>
    </AuthFrame>
  );
}

export function Component() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const check = useQuery({ ...resetLinkQueryOptions(token), enabled: token !== '' });
  if (!token) return <DeadLink message="This page needs the link from the reset e-mail. Open it again from there." />;
  if (check.isPending) return <Loading label="Checking the link…" />;
  if (check.isError) return <DeadLink message={check.error.message} />;
  return <ResetForm token={token} />;
}

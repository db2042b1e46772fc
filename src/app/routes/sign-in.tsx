// Sign in with e-mail and password; then on to the page asked for, or the role's start page.
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { loginBody, type LoginBody } from '../../../shared/schemas';
import { Button } from '../../components/ui/button';
import { TextField } from '../../components/ui/field';
import { Notice } from '../../components/ui/page';
import { useSignIn } from '../../features/auth/api/use-sign-in';
import { useForgetPreviousUser } from '../../features/auth/api/use-sign-out';
import { meQueryOptions } from '../../lib/me';
import { homeFor } from '../guards';
import { AuthFrame } from '../../features/auth/components/auth-frame';
import { isApiError } from '../../lib/api-client';
import { applyFieldErrors } from '../../lib/form-errors';

export function Component() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const signIn = useSignIn();
  useForgetPreviousUser();
  const form = useForm<LoginBody>({ resolver: zodResolver(loginBody), defaultValues: { email: '', password: '' } });
  const { errors } = form.formState;

  const onSubmit = form.handleSubmit(async (values) => {
    try {
      await signIn.mutateAsync(values);
      const me = await queryClient.fetchQuery(meQueryOptions());
      const next = params.get('next');
      navigate(next && next.startsWith('/') && !next.startsWith('//') ? next : homeFor(me), { replace: true });
    } catch (err) {
      // Field errors go beside their fields; anything else shows as the notice above the form.
      applyFieldErrors(err, form.setError);
    }
  });

  return (
    <AuthFrame title="Sign in">
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
        {signIn.error && !Object.keys(isApiError(signIn.error) ? signIn.error.fields : {}).length ? (
          <Notice tone="error">{signIn.error.message}</Notice>
        ) : null}
        <TextField
          label="E-mail"
          type="email"
          autoComplete="username"
          inputMode="email"
          error={errors.email?.message}
          {...form.register('email')}
        />
        <TextField
          label="Password"
          type="password"
          autoComplete="current-password"
          error={errors.password?.message}
          {...form.register('password')}
        />
        <Button type="submit" size="lg" disabled={form.formState.isSubmitting}>
          {form.formState.isSubmitting ? 'Signing in…' : 'Sign in'}
        </Button>
        <Link to="/forgot-password" className="text-center text-ink-700 underline underline-offset-2">
          Forgot your password?
        </Link>
      </form>
    </AuthFrame>
  );
}

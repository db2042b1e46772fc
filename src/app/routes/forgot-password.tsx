// Forgot password: ask for a reset link by e-mail. The answer never says whether the address is known.
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import { forgotPasswordBody, type ForgotPasswordBody } from '../../../shared/schemas';
import { Button } from '../../components/ui/button';
import { TextField } from '../../components/ui/field';
import { Notice } from '../../components/ui/page';
import { AuthFrame } from '../../features/auth/components/auth-frame';
import { useRequestReset } from '../../features/password-reset/api/use-request-reset';
import { applyFieldErrors } from '../../lib/form-errors';

export function Component() {
  const request = useRequestReset();
  const form = useForm<ForgotPasswordBody>({ resolver: zodResolver(forgotPasswordBody), defaultValues: { email: '' } });
  const { errors, isSubmitting } = form.formState;

  const onSubmit = form.handleSubmit(async (values) => {
    try {
      await request.mutateAsync(values);
    } catch (err) {
      applyFieldErrors(err, form.setError);
    }
  });

  if (request.isSuccess) {
    return (
      <AuthFrame title="Check your e-mail">
        <div className="flex flex-col gap-4">
          <Notice tone="success">{request.data.message}</Notice>
          <p className="text-ink-700">
            Nothing there after a few minutes? Look in the spam folder, or check the address and ask again.
          </p>
          <Link to="/sign-in" className="text-center text-ink-700 underline underline-offset-2">
            Back to sign in
          </Link>
        </div>
      </AuthFrame>
    );
  }

  return (
    <AuthFrame title="Forgot password">
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
        <p className="text-ink-700">
          Enter the address you sign in with. We will send it a link to choose a new password.
        </p>
        {request.error && !errors.email ? <Notice tone="error">{request.error.message}</Notice> : null}
        <TextField
          label="E-mail"
          type="email"
          autoComplete="username"
          inputMode="email"
          error={errors.email?.message}
          {...form.register('email')}
        />
        <Button type="submit" size="lg" disabled={isSubmitting}>
          {isSubmitting ? 'Sending…' : 'Send the link'}
        </Button>
        <Link to="/sign-in" className="text-center text-ink-700 underline underline-offset-2">
          Back to sign in
        </Link>
      </form>
    </AuthFrame>
  );
}

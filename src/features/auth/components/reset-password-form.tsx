// Reset password: the link from the e-mail is checked first; a used or expired link says so plainly. The
// page decides where the account goes once the new password is saved (signed in, or to sign in).
import { zodResolver } from '@hookform/resolvers/zod';
import { useQuery, useQueryClient } from '@tanstack/react-query';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import { resetPasswordBody, type Me, type ResetPasswordBody } from '../../../../shared/schemas';
import { NewPasswordFields } from '../../../components/ui/new-password-fields';
import { Form, FormFailure, SubmitButton } from '../../../components/ui/form';
import { Loading, Notice } from '../../../components/ui/page';
import { applyFieldErrors } from '../../../lib/form-errors';
import { meQueryOptions } from '../../../lib/me';
import { resetLinkQueryOptions } from '../api/reset-link';
import { useResetPassword } from '../api/use-reset-password';
import { AuthFrame } from './auth-frame';

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

/** `me` is the signed-in account, or null when the server did not sign it in. */
type OnReset = (me: Me | null) => void;

function ResetForm({ token, onReset }: { token: string; onReset: OnReset }) {
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
      onReset(done.signedIn ? await queryClient.fetchQuery(meQueryOptions()) : null);
    } catch (err) {
      applyFieldErrors(err, form.setError);
    }
  });

  return (
    <AuthFrame title="Choose a new password">
      <Form onSubmit={onSubmit}>
        <FormFailure failure={reset.error} fieldErrors={errors} />
        {errors.token ? <Notice tone="error">{errors.token.message}</Notice> : null}
        <NewPasswordFields
          password={{ label: 'New password', error: errors.password?.message, field: form.register('password') }}
          again={{
            label: 'New password again',
            error: errors.confirmPassword?.message,
            field: form.register('confirmPassword'),
          }}
        />
        <p className="text-sm text-ink-600">Saving it signs you out on every other device.</p>
        <SubmitButton size="lg" busy={isSubmitting} busyText="Saving…">
          Save and sign in
        </SubmitButton>
      </Form>
    </AuthFrame>
  );
}

/** The whole reset page for the link's token ('' when the address has none). */
export function ResetPassword({ token, onReset }: { token: string; onReset: OnReset }) {
  const check = useQuery({ ...resetLinkQueryOptions(token), enabled: token !== '' });
  if (!token) return <DeadLink message="This page needs the link from the reset e-mail. Open it again from there." />;
  if (check.isPending) return <Loading label="Checking the link…" />;
  if (check.isError) return <DeadLink message={check.error.message} />;
  return <ResetForm token={token} onReset={onReset} />;
}

// Forgot password: ask for a reset link by e-mail. The answer never says whether the address is known.
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import { forgotPasswordBody, type ForgotPasswordBody } from '../../../../shared/schemas';
import { EmailField } from '../../../components/ui/field';
import { Form, FormFailure, SubmitButton } from '../../../components/ui/form';
import { Notice } from '../../../components/ui/page';
import { applyFieldErrors } from '../../../lib/form-errors';
import { useRequestReset } from '../api/use-request-reset';
import { AuthFrame } from './auth-frame';

export function ForgotPasswordForm() {
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
      <Form onSubmit={onSubmit}>
        <p className="text-ink-700">
          Enter the address you sign in with. We will send it a link to choose a new password.
        </p>
        <FormFailure failure={request.error} fieldErrors={errors} />
        <EmailField error={errors.email?.message} {...form.register('email')} />
        <SubmitButton size="lg" busy={isSubmitting} busyText="Sending…">
          Send the link
        </SubmitButton>
        <Link to="/sign-in" className="text-center text-ink-700 underline underline-offset-2">
          Back to sign in
        </Link>
      </Form>
    </AuthFrame>
  );
}

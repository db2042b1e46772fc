// Sign in with e-mail and password; the page decides where the signed-in account goes next.
import { zodResolver } from '@hookform/resolvers/zod';
import { useQueryClient } from '@tanstack/react-query';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import { loginBody, type LoginBody, type Me } from '../../../../shared/schemas';
import { EmailField, TextField } from '../../../components/ui/field';
import { Form, FormFailure, SubmitButton } from '../../../components/ui/form';
import { applyFieldErrors } from '../../../lib/form-errors';
import { meQueryOptions } from '../../../lib/me';
import { useSignIn } from '../api/use-sign-in';

export function SignInForm({ onSignedIn }: { onSignedIn: (me: Me) => void }) {
  const queryClient = useQueryClient();
  const signIn = useSignIn();
  const form = useForm<LoginBody>({ resolver: zodResolver(loginBody), defaultValues: { email: '', password: '' } });
  const { errors, isSubmitting } = form.formState;

  const onSubmit = form.handleSubmit(async (values) => {
    try {
      await signIn.mutateAsync(values);
      onSignedIn(await queryClient.fetchQuery(meQueryOptions()));
    } catch (err) {
      // Field errors go beside their fields; anything else shows as the notice above the form.
      applyFieldErrors(err, form.setError);
    }
  });

  return (
    <Form onSubmit={onSubmit}>
      <FormFailure failure={signIn.error} fieldErrors={errors} />
      <EmailField error={errors.email?.message} {...form.register('email')} />
      <TextField
        label="Password"
        type="password"
        autoComplete="current-password"
        error={errors.password?.message}
        {...form.register('password')}
      />
      <SubmitButton size="lg" busy={isSubmitting} busyText="Signing in…">
        Sign in
      </SubmitButton>
      <Link to="/forgot-password" className="text-center text-ink-700 underline underline-offset-2">
        Forgot your password?
      </Link>
    </Form>
  );
}

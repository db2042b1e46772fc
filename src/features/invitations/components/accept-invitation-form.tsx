// The invitee's form: a name and a new password, or — for an address that already has an account —
// that account's password. Signs in on success.
import { zodResolver } from '@hookform/resolvers/zod';
import { useQueryClient } from '@tanstack/react-query';
import { useForm, type UseFormReturn } from 'react-hook-form';
import { Link, useNavigate } from 'react-router-dom';
import {
  acceptExistingAccountBody,
  acceptNewAccountBody,
  type AcceptExistingAccountBody,
  type AcceptNewAccountBody,
  type InvitationPreview,
} from '../../../../shared/schemas';
import { NewPasswordFields } from '../../../components/ui/new-password-fields';
import { TextField } from '../../../components/ui/field';
import { Form, FormFailure, SubmitButton } from '../../../components/ui/form';
import { applyFieldErrors } from '../../../lib/form-errors';
import { meQueryOptions } from '../../../lib/me';
import { useAcceptInvitation } from '../api/use-accept-invitation';

const ROLE_WORDS = { head_coach: 'head coach', coach: 'coach', athlete: 'athlete' } as const;

/** Accepts with the form's values, then goes to the new member's start page; field errors go on the form. */
function useAcceptSubmit<T extends AcceptNewAccountBody | AcceptExistingAccountBody>(form: UseFormReturn<T>) {
  const accept = useAcceptInvitation();
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const onSubmit = form.handleSubmit(async (values) => {
    try {
      await accept.mutateAsync(values);
      const me = await queryClient.fetchQuery(meQueryOptions());
      navigate(me.role === 'athlete' ? '/my-week' : '/board', { replace: true });
    } catch (err) {
      applyFieldErrors(err, form.setError);
    }
  });
  return { accept, onSubmit };
}

function NewAccountForm({ token }: { token: string }) {
  const form = useForm<AcceptNewAccountBody>({
    resolver: zodResolver(acceptNewAccountBody),
    defaultValues: { token, name: '', password: '', confirmPassword: '' },
  });
  const { errors, isSubmitting } = form.formState;
  const { accept, onSubmit } = useAcceptSubmit(form);
  return (
    <Form onSubmit={onSubmit}>
      <FormFailure failure={accept.error} fieldErrors={errors} />
      <TextField label="Your name" autoComplete="name" error={errors.name?.message} {...form.register('name')} />
      <NewPasswordFields
        password={{ label: 'Choose a password', error: errors.password?.message, field: form.register('password') }}
        again={{
          label: 'The password again',
          error: errors.confirmPassword?.message,
          field: form.register('confirmPassword'),
        }}
      />
      <SubmitButton size="lg" busy={isSubmitting} busyText="Joining…">
        Join the team
      </SubmitButton>
    </Form>
  );
}

function ExistingAccountForm({ token }: { token: string }) {
  const form = useForm<AcceptExistingAccountBody>({
    resolver: zodResolver(acceptExistingAccountBody),
    defaultValues: { token, password: '' },
  });
  const { errors, isSubmitting } = form.formState;
  const { accept, onSubmit } = useAcceptSubmit(form);
  return (
    <Form onSubmit={onSubmit}>
      <p className="text-ink-700">This address already has a Rackturn account. Confirm with its password.</p>
      <FormFailure failure={accept.error} fieldErrors={errors} />
      <TextField
        label="Your password"
        type="password"
        autoComplete="current-password"
        error={errors.password?.message}
        {...form.register('password')}
      />
      <SubmitButton size="lg" busy={isSubmitting} busyText="Joining…">
        Join the team
      </SubmitButton>
      <Link to="/forgot-password" className="text-center text-ink-700 underline underline-offset-2">
        Forgot your password?
      </Link>
    </Form>
  );
}

export function AcceptInvitationForm({ token, preview }: { token: string; preview: InvitationPreview }) {
  return (
    <div className="flex flex-col gap-4">
      <p className="text-ink-800">
        {preview.invitedByName ?? 'The head coach'} invites you to <strong>{preview.teamName}</strong> as{' '}
        {preview.role === 'athlete' ? 'an' : 'a'} {ROLE_WORDS[preview.role]}
        {preview.athleteName ? ` (${preview.athleteName} on the roster)` : ''}.
      </p>
      <dl className="rounded-md border border-chalk-300 bg-chalk-100 px-3 py-2 text-sm">
        <dt className="font-semibold text-ink-600">Signing in as</dt>
        <dd className="break-all text-ink-900">{preview.email}</dd>
      </dl>
      {preview.existingAccount ? <ExistingAccountForm token={token} /> : <NewAccountForm token={token} />}
    </div>
  );
}

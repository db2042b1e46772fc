// The scaffolding every form shares, for forms built on react-hook-form: the form element (the browser's
// own checks off, the schema's instead), a failure notice above the fields unless the fields show the
// errors themselves, and a submit button that says what it is doing while busy.
import type { ButtonHTMLAttributes, FormHTMLAttributes, ReactNode } from 'react';
import type { FieldErrors } from 'react-hook-form';
import { Button } from './button';
import { Notice } from './page';

export function Form({ className = 'flex flex-col gap-4', ...props }: FormHTMLAttributes<HTMLFormElement>) {
  return <form noValidate className={className} {...props} />;
}

/** The failure of the last submit, unless a field shows what went wrong beside itself. */
export function FormFailure({
  failure,
  fieldErrors,
}: {
  failure: { message: string } | null | undefined;
  fieldErrors: FieldErrors;
}) {
  if (!failure || Object.keys(fieldErrors).length > 0) return null;
  return <Notice tone="error">{failure.message}</Notice>;
}

export function SubmitButton({
  busy,
  busyText,
  children,
  ...props
}: Omit<ButtonHTMLAttributes<HTMLButtonElement>, 'type'> & {
  busy: boolean;
  busyText: string;
  children: ReactNode;
  size?: 'sm' | 'md' | 'lg';
  variant?: 'primary' | 'secondary' | 'ghost' | 'danger';
}) {
  return (
    <Button type="submit" disabled={busy} {...props}>
      {busy ? busyText : children}
    </Button>
  );
}

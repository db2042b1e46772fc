// A new password and the same again: the pair every form that sets a password asks for (reset, joining a team).
import type { UseFormRegisterReturn } from 'react-hook-form';
import { TextField } from './field';

interface PasswordField {
  label: string;
  error?: string;
  /** What react-hook-form's register() gave for this field. */
  field: UseFormRegisterReturn;
}

export function NewPasswordFields({ password, again }: { password: PasswordField; again: PasswordField }) {
  return (
    <>
      <TextField
        label={password.label}
        type="password"
        autoComplete="new-password"
        hint="At least 10 characters."
        error={password.error}
        {...password.field}
      />
      <TextField label={again.label} type="password" autoComplete="new-password" error={again.error} {...again.field} />
    </>
  );
}

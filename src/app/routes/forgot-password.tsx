// Forgot password: the form asks for a reset link by e-mail.
import { ForgotPasswordForm } from '../../features/auth/components/forgot-password-form';

export function Component() {
  return <ForgotPasswordForm />;
}

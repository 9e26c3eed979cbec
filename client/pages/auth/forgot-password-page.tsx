import { AuthPanel } from '../../features/auth/components/auth-panel';
import { ForgotPasswordForm } from '../../features/auth/components/forgot-password-form';

export function ForgotPasswordPage() {
  return (
    <>
      <title>Reset your password · Compline</title>
      <AuthPanel title="Reset your password" description="Enter the e-mail address you sign in with. We send a link that works for one hour.">
        <ForgotPasswordForm />
      </AuthPanel>
    </>
  );
}

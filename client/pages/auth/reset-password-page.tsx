import { Link, useSearchParams } from 'react-router-dom';
import { buttonClasses } from '../../components/ui/button';
import { Notice } from '../../components/ui/notice';
import { AuthPanel } from '../../features/auth/components/auth-panel';
import { ResetPasswordForm } from '../../features/auth/components/reset-password-form';

export function ResetPasswordPage() {
  const [params] = useSearchParams();
  const token = params.get('token');
  return (
    <>
      <title>Choose a new password · Compline</title>
      <AuthPanel title="Choose a new password">
        {token ? (
          <ResetPasswordForm token={token} />
        ) : (
          <div className="flex flex-col gap-6">
            <Notice tone="warning" title="This page needs the link from your e-mail">
              Open the link in the reset e-mail as it is, or ask for a new one.
            </Notice>
            <Link to="/forgot-password" className={buttonClasses('secondary', 'md', 'self-start')}>
              Ask for a reset link
            </Link>
          </div>
        )}
      </AuthPanel>
    </>
  );
}

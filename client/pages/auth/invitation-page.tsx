import { Link, useSearchParams } from 'react-router-dom';
import { buttonClasses } from '../../components/ui/button';
import { Notice } from '../../components/ui/notice';
import { AuthPanel } from '../../features/auth/components/auth-panel';
import { InvitationAcceptance } from '../../features/auth/components/invitation-acceptance';

export function InvitationPage() {
  const [params] = useSearchParams();
  const token = params.get('token');
  return (
    <>
      <title>Your invitation · Compline</title>
      <AuthPanel title="Join Compline" description="Check the details, then choose the password you will sign in with.">
        {token ? (
          <InvitationAcceptance token={token} />
        ) : (
          <div className="flex flex-col gap-6">
            <Notice tone="warning" title="This page needs the link from your invitation e-mail">
              Open the link in the e-mail as it is. If it has expired, ask your office manager for a new invitation.
            </Notice>
            <Link to="/sign-in" className={buttonClasses('secondary', 'md', 'self-start')}>
              Go to sign in
            </Link>
          </div>
        )}
      </AuthPanel>
    </>
  );
}

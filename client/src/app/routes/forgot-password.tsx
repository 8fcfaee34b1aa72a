import { RESET_LINK_MINUTES } from '@contract';
import { PublicPage } from '../../components/layout/public-page';
import { ForgotPasswordForm } from '../../features/auth/components/forgot-password-form';

export default function ForgotPasswordRoute() {
  return (
    <PublicPage
      title="Forgot your password?"
      lead={`Enter the e-mail you sign in with. We send a link to set a new password; it works for ${RESET_LINK_MINUTES} minutes.`}
    >
      <ForgotPasswordForm />
    </PublicPage>
  );
}

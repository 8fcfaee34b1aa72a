import { PublicPage } from '../../components/layout/public-page';
import { ResetPasswordForm } from '../../features/auth/components/reset-password-form';

export default function ResetPasswordRoute() {
  return (
    <PublicPage title="Set a new password" lead="Choose the password you will sign in with from now on.">
      <ResetPasswordForm />
    </PublicPage>
  );
}

import { Link, useNavigate, useParams } from 'react-router-dom';

import { AuthLayout } from '../../components/layouts/auth-layout';
import { useToast } from '../../components/toaster';
import { paths } from '../../config/paths';
import { ResetPasswordForm } from '../../features/password-reset/components/reset-password-form';

/** `/reset-password/:token`, from the e-mailed link. */
export default function ResetPasswordRoute() {
  const { token = '' } = useParams();
  const navigate = useNavigate();
  const toast = useToast();
  return (
    <AuthLayout
      title="Set a new password"
      intro={<p>Setting it signs your account out on every other device.</p>}
    >
      <ResetPasswordForm
        token={token}
        requestAgain={
          <Link to={paths.forgotPassword.getHref()}>Ask for a new link to set your password</Link>
        }
        onDone={(message) => {
          toast(message);
          void navigate(paths.signIn.getHref(), { replace: true });
        }}
      />
    </AuthLayout>
  );
}

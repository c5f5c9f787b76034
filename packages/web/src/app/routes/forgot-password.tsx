import { Link } from 'react-router-dom';

import { AuthLayout } from '../../components/layouts/auth-layout';
import { paths } from '../../config/paths';
import { ForgotPasswordForm } from '../../features/password-reset/components/forgot-password-form';

export default function ForgotPasswordRoute() {
  return (
    <AuthLayout
      title="Forgot your password?"
      intro={
        <p>
          We e-mail you a link to set a new one. Remembered it?{' '}
          <Link to={paths.signIn.getHref()}>Sign in</Link>.
        </p>
      }
    >
      <ForgotPasswordForm />
    </AuthLayout>
  );
}

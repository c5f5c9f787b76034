import { Link, useParams } from 'react-router-dom';

import { AuthLayout } from '../../components/layouts/auth-layout';
import { paths } from '../../config/paths';
import { VerifyEmailView } from '../../features/email-verification/components/verify-email-view';

/** `/verify-email/:token`, from the e-mailed link; works signed in or not. */
export default function VerifyEmailRoute() {
  const { token = '' } = useParams();
  return (
    <AuthLayout
      title="Confirm your e-mail address"
      intro={<p>This tells Workback the address on your account is really yours.</p>}
    >
      <VerifyEmailView
        token={token}
        next={<Link to={paths.app.root.getHref()}>Open Workback</Link>}
      />
    </AuthLayout>
  );
}

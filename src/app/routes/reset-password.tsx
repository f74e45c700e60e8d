import { Link, useNavigate, useParams } from 'react-router-dom';
import { AuthCard, NewPasswordForm } from '../../features/auth';
import { notifySuccess } from '../../lib/notify';
import { PageColumn } from '../layout';
import { PageTitle } from '../../components/ui/page-title';

export function ResetPasswordPage() {
  const { token = '' } = useParams();
  const navigate = useNavigate();
  return (
    <PageColumn width="narrow">
      <PageTitle>New password</PageTitle>
      <AuthCard
        title="Choose a new password"
        footer={
          <Link to="/reset" className="hover:text-slate-200 hover:underline">
            Need a new link?
          </Link>
        }
      >
        <NewPasswordForm
          token={token}
          onDone={() => {
            notifySuccess('Password changed', 'Sign in with your new password.');
            navigate('/signin', { replace: true });
          }}
        />
      </AuthCard>
    </PageColumn>
  );
}

import { Link } from 'react-router-dom';
import { AuthCard, ResetRequestForm } from '../../features/auth';
import { PageColumn } from '../layout';
import { PageTitle } from '../../components/ui/page-title';

export function ResetRequestPage() {
  return (
    <PageColumn width="narrow">
      <PageTitle>Reset password</PageTitle>
      <AuthCard
        title="Reset your password"
        subtitle="We will e-mail you a link to choose a new one."
        footer={
          <Link to="/signin" className="text-amber-300 hover:underline">
            Back to sign in
          </Link>
        }
      >
        <ResetRequestForm />
      </AuthCard>
    </PageColumn>
  );
}

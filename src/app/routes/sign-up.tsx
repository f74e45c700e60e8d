import { useQuery } from '@tanstack/react-query';
import { Link, Navigate, useNavigate, useSearchParams } from 'react-router-dom';
import { meQueryOptions, AuthCard, SignUpForm } from '../../features/auth';
import { notifySuccess } from '../../lib/notify';
import { safeNext } from '../../lib/safe-next';
import { PageColumn } from '../layout';
import { PageTitle } from '../../components/ui/page-title';

export function SignUpPage() {
  const [params] = useSearchParams();
  const next = safeNext(params.get('next'));
  const navigate = useNavigate();
  const me = useQuery(meQueryOptions);
  if (me.data) return <Navigate to={next} replace />;
  const withNext = params.get('next') ? `?next=${encodeURIComponent(next)}` : '';
  return (
    <PageColumn width="narrow">
      <PageTitle>Sign up</PageTitle>
      <AuthCard
        title="Create your account"
        subtitle="Draw, simulate and plan gate-level circuits together."
        footer={
          <span>
            Already have an account?{' '}
            <Link to={`/signin${withNext}`} className="text-amber-300 hover:underline">
              Sign in
            </Link>
          </span>
        }
      >
        <SignUpForm
          defaultEmail={params.get('email') ?? ''}
          onSignedUp={(user) => {
            notifySuccess(`Welcome, ${user.name}`);
            navigate(next, { replace: true });
          }}
        />
      </AuthCard>
    </PageColumn>
  );
}

import { useQuery } from '@tanstack/react-query';
import { Link, Navigate, useNavigate, useSearchParams } from 'react-router-dom';
import { meQueryOptions, AuthCard, SignInForm } from '../../features/auth';
import { safeNext } from '../../lib/safe-next';
import { PageColumn } from '../layout';
import { PageTitle } from '../../components/ui/page-title';

export function SignInPage() {
  const [params] = useSearchParams();
  const next = safeNext(params.get('next'));
  const navigate = useNavigate();
  const me = useQuery(meQueryOptions);
  if (me.data) return <Navigate to={next} replace />;
  const withNext = params.get('next') ? `?next=${encodeURIComponent(next)}` : '';
  return (
    <PageColumn width="narrow">
      <PageTitle>Sign in</PageTitle>
      <div className="flex flex-col gap-4">
        <AuthCard
          title="Sign in"
          subtitle="Open your boards and the boards shared with you."
          footer={
            <div className="flex flex-wrap justify-between gap-2">
              <Link to={`/signup${withNext}`} className="text-amber-300 hover:underline">
                Create an account
              </Link>
              <Link to="/reset" className="hover:text-slate-200 hover:underline">
                Forgot your password?
              </Link>
            </div>
          }
        >
          <SignInForm showDemo onSignedIn={() => navigate(next, { replace: true })} />
        </AuthCard>
      </div>
    </PageColumn>
  );
}

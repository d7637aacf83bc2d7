import { Navigate, useNavigate, useSearchParams } from 'react-router';
import { Terminal } from 'lucide-react';
import { useCurrentUser } from '../../../lib/auth';
import { safeNextPath } from '../../../lib/safe-next';
import { AuthCard } from '../components/auth-card';
import { SignInForm } from '../components/sign-in-form';

export function SignInPage() {
  const [searchParams] = useSearchParams();
  const navigate = useNavigate();
  const next = safeNextPath(searchParams.get('next'));
  const { data: user } = useCurrentUser();

  if (user) return <Navigate to={next} replace />;

  return (
    <AuthCard
      title="Sign in to Lotwise"
      intro="Stock, preparations and shared orders for your lab."
    >
      <SignInForm onSignedIn={() => navigate(next, { replace: true })} />
      <p className="mt-5 flex gap-2 border-t border-ink-200 pt-4 text-xs leading-5 text-ink-600">
        <Terminal aria-hidden="true" className="mt-0.5 size-3.5 shrink-0" />
        <span>
          Trying Lotwise out? The server prints the demo accounts and their passwords in its console
          when it starts.
        </span>
      </p>
    </AuthCard>
  );
}

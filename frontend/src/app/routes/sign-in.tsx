import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { Notice } from '@/components/ui/notice';
import { useMe } from '@/features/auth/api/get-me';
import { SignInForm } from '@/features/auth/components/sign-in-form';
import { safeNextPath } from '@/lib/session';

export function SignInRoute() {
  const [params] = useSearchParams();
  const next = safeNextPath(params.get('next'));
  const navigate = useNavigate();
  const me = useMe();

  return (
    <div className="mx-auto flex w-full max-w-sm flex-col gap-5 px-5 py-12">
      <title>Sign in · Redward</title>
      <div>
        <h1 className="text-xl font-semibold text-ink-950">Sign in to Redward</h1>
        <p className="mt-1 text-ink-600">From reduced spectra to confirmed redshifts, read twice.</p>
      </div>
      {/* Already signed in (e.g. an invitation for another address): the form switches account. */}
      {me.data ? (
        <Notice tone="info">
          You are signed in as {me.data.email}. <Link to={next} className="underline">Continue</Link>, or sign in below as someone else.
        </Notice>
      ) : null}
      <div className="rounded-panel border border-paper-300 bg-paper-50 p-5">
        <SignInForm onSignedIn={() => void navigate(next, { replace: true })} />
      </div>
      <p className="text-sm text-ink-500">No account? Accounts are created from an invitation sent by a campaign lead.</p>
    </div>
  );
}

import { useSearchParams } from 'react-router';
import { CautionBlock } from '../../components/ui/caution-block';
import { ShadowloopMark } from '../../components/ui/shadowloop-mark';
import { PLANT_NAME, PRODUCT_SUMMARY } from '../../config/product';

function SignInProblem({ code }: { code: string }) {
  return (
    <div
      role="alert"
      className="rounded-sm border border-diverged/50 border-l-4 border-l-diverged bg-panel px-4 py-3 text-sm"
    >
      <p className="font-bold">Sign-in did not complete</p>
      <p className="mt-1">
        {code === 'sign-in-failed'
          ? 'The plant account sign-in was cancelled or refused.'
          : 'The identity provider did not hand back a signed-in account.'}{' '}
        Try again; if it keeps failing, tell the site administrator.
      </p>
    </div>
  );
}

export function SignInPage() {
  const [searchParams] = useSearchParams();
  const returnTo = searchParams.get('returnTo');
  const problem = searchParams.get('error');

  return (
    <main className="flex min-h-screen items-center justify-center bg-paper px-4 py-10 text-ink">
      <title>Sign in · Shadowloop</title>
      <div className="w-full max-w-lg space-y-5">
        <div className="flex items-center gap-3">
          <ShadowloopMark size={44} />
          <div>
            <h1 className="text-3xl font-bold tracking-tight">Shadowloop</h1>
            <p className="text-sm text-ink/75">{PLANT_NAME}</p>
          </div>
        </div>
        <p>{PRODUCT_SUMMARY}</p>
        {problem ? <SignInProblem code={problem} /> : null}
        <form method="get" action="/auth/login">
          {returnTo?.startsWith('/') ? <input type="hidden" name="returnTo" value={returnTo} /> : null}
          <button
            type="submit"
            className="w-full rounded-sm border border-ink bg-ink px-4 py-2.5 text-base font-bold text-paper hover:bg-ink/85 focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-twin"
          >
            Sign in with your plant account
          </button>
        </form>
        <CautionBlock />
      </div>
    </main>
  );
}

import { Navigate, useSearchParams } from 'react-router-dom';
import { signInHref, useMe } from '../api/get-me';

export function SignInPage() {
  const [params] = useSearchParams();
  const next = params.get('next') ?? '/team';
  const me = useMe();
  if (me.data?.user) return <Navigate to={next} replace />;
  return (
    <section className="mx-auto max-w-md px-4 py-12">
      <h1 className="text-2xl font-semibold">Sign in to the team library</h1>
      <p className="mt-2 text-ink-soft">
        Studies, revisions and baselines are kept per team. Signing in goes through your organisation's OAuth provider
        (on this machine, a local stand-in that lists the demo people).
      </p>
      {params.get('error') && (
        <p role="alert" className="mt-4 rounded bg-fault-soft p-2 text-sm text-fault">
          The sign-in was not completed. Try again; if it keeps failing, check that the OAuth provider is reachable.
        </p>
      )}
      <a className="mt-6 inline-block rounded bg-ink px-4 py-2 text-paper hover:bg-ink-soft" href={signInHref(next)}>
        Continue to sign-in
      </a>
    </section>
  );
}

import { useLocation } from 'react-router-dom';
import { signInHref, useMe } from '../api/get-me';
import { useSignOut } from '../api/sign-out';

/** Who is signed in, with sign-in or sign-out; small enough for any header. */
export function AccountBar() {
  const me = useMe();
  const signOut = useSignOut();
  const location = useLocation();
  if (me.isPending) return <span className="text-xs text-ink-faint">…</span>;
  if (me.isError) return <span className="text-xs text-fault">account unavailable</span>;
  if (!me.data.user) {
    return (
      <a className="rounded border border-rule px-2 py-1 text-sm text-slate hover:bg-slate-soft" href={signInHref(location.pathname + location.search)}>
        Sign in
      </a>
    );
  }
  return (
    <span className="flex items-center gap-2 text-sm">
      <span data-testid="signed-in-as" title={me.data.user.login}>
        {me.data.user.name}
      </span>
      <button
        type="button"
        className="rounded border border-rule px-2 py-0.5 text-xs text-ink-soft hover:bg-rule/40"
        onClick={() => signOut.mutate(undefined, { onSuccess: () => window.location.assign('/sign-in') })}
        disabled={signOut.isPending}
      >
        Sign out
      </button>
    </span>
  );
}

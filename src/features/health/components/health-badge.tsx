import { useHealth } from '../api/get-health';

/** Live server and database state, for the shell and the home page. */
export function HealthBadge() {
  const { data, isPending, isError } = useHealth();
  const dbUp = data?.db === 'up';
  const label = isPending ? 'checking server…' : isError ? 'server unreachable' : dbUp ? 'database up' : 'database down';
  const tone = isPending
    ? 'bg-paper text-ink-faint border-rule'
    : dbUp
      ? 'bg-verdigris-soft text-verdigris border-verdigris/40'
      : 'bg-fault-soft text-fault border-fault/40';
  return (
    <span
      role="status"
      aria-live="polite"
      data-testid="health"
      className={`inline-flex items-center gap-2 rounded-full border px-3 py-1 text-sm ${tone}`}
    >
      <span aria-hidden className={`h-2 w-2 rounded-full ${dbUp ? 'bg-verdigris' : isPending ? 'bg-ink-faint' : 'bg-fault'}`} />
      {label}
      {data?.version ? <span className="num text-xs text-ink-faint">v{data.version}</span> : null}
    </span>
  );
}

import { useQuery } from '@tanstack/react-query';
import { HealthBadge } from '../../features/health/components/health-badge';
import { solver } from '../../lib/solver-client';

/** A typical autoclave set point given in °F, converted by the solver worker. */
function WorkerCheck() {
  const { data, isError } = useQuery({
    queryKey: ['worker', 'convert', 350],
    queryFn: () => solver().convert('temperature', 350, '°F', '°C'),
    staleTime: Infinity,
  });
  return (
    <p className="text-sm text-ink-soft" data-testid="worker-check">
      Solver worker:{' '}
      {isError ? (
        <span className="text-fault">not responding</span>
      ) : data === undefined ? (
        'starting…'
      ) : (
        <span>
          350 °F set point = <span className="num">{data.toFixed(1)} °C</span>
        </span>
      )}
    </p>
  );
}

export function HomeRoute() {
  return (
    <section className="mx-auto max-w-4xl px-4 py-10">
      <h1 className="text-3xl font-semibold tracking-tight">Dwellform</h1>
      <p className="mt-2 max-w-2xl text-ink-soft">
        Shape cure cycles for thermoset composite parts: see degree of cure, exotherm, residual stress and warpage
        follow as you move a ramp or a dwell.
      </p>
      <div className="mt-6 flex flex-col gap-3">
        <HealthBadge />
        <WorkerCheck />
      </div>
    </section>
  );
}

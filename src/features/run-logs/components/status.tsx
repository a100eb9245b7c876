import { ApiError } from '../../../lib/api-client';

export const Loading = ({ what }: { what: string }) => <p className="p-6 text-sm text-ink-faint">Loading {what}…</p>;

export function LoadError({ error, what }: { error: Error; what: string }) {
  const status = error instanceof ApiError ? error.status : 0;
  const hint =
    status === 401 ? 'Sign in to see it.' : status === 404 ? 'It does not exist, or belongs to a team you are not in.' : 'Check that the server is running, then reload.';
  return (
    <div role="alert" className="m-6 rounded border border-fault-soft bg-fault-soft/40 p-3 text-sm">
      <p className="font-medium text-fault">Could not load {what}: {error.message}</p>
      <p className="mt-1 text-ink-soft">{hint}</p>
    </div>
  );
}

/** What predictions are and are not: shown on the review page and printed on the review record. */
export const CAUTIONS = [
  'The replay is a model prediction from the measured air and tool temperatures. It does not replace coupon tests, and it does not take the place of the material review board, whose authority over the disposition of the part stands.',
  'Predictions are only as good as the resin card, the layup and the heat-transfer settings of the study; the measured-versus-predicted differences at the thermocouples show how well they describe this run.',
  'Findings flag departures from the study’s process limits and cycle as entered in Dwellform; the governing process specification decides.',
];

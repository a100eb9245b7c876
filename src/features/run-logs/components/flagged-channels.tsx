import type { HygieneReport } from '../../../../shared/run-log/index';

/** Channels hygiene flagged: which were left out of the spec check and the replay, which the uploader kept, and why. */
export function FlaggedChannels({ hygiene }: { hygiene: HygieneReport }) {
  // records made before the list was kept have none
  const flagged = hygiene.flagged ?? [];
  if (flagged.length === 0) return null;
  return (
    <div className="mt-3 text-sm" data-testid="flagged-channels">
      <p className="font-medium">Channels flagged by the data-hygiene check</p>
      <ul className="mt-1 list-disc pl-5">
        {flagged.map((f) => (
          <li key={f.key} data-excluded={f.excluded}>
            <span className="font-medium">{f.label}</span>: {f.excluded ? 'left out of the spec check and the replay' : 'kept at the uploader’s request'} — {f.reason}
          </li>
        ))}
      </ul>
    </div>
  );
}

import type { RunLogRecord } from '../../../../shared/run-log/index';
import type { RunLogDetail } from '../api/run-logs-api';

const f = (v: number | null | undefined, digits = 3) => (v === null || v === undefined ? '—' : String(Number(v.toPrecision(digits))));

/** "Baseline: <study title>, revision 2, part TB-2407": which prediction the replay is set beside. */
export function baselineLabel(record: RunLogRecord, named: RunLogDetail['baseline']): string | null {
  const b = record.replay?.baseline;
  if (!b) return null;
  const study = named?.studyTitle ? `“${named.studyTitle}”` : `study ${b.studyId}`;
  const part = named?.part ? `, part ${named.part.partNumber}` : '';
  return `Baseline: ${study}, revision ${b.number}${part}`;
}

/** Replay figures beside the baseline's, and the predictions at each thermocouple's place. */
export function ReplayResults({ record, baseline }: { record: RunLogRecord; baseline: RunLogDetail['baseline'] }) {
  const replay = record.replay;
  if (!replay) return <p className="mt-2 text-sm text-fault">The replay could not run: {record.replayError}</p>;
  const b = replay.baseline?.summary;
  const baseStress = replay.baseline?.maxTransverseStressMPa;
  const rows: [string, number, number | undefined, string][] = [
    ['Lowest final degree of cure', replay.summary.finalCureMin, b?.finalCureMin, ''],
    ['Final Tg', replay.summary.finalTgC, b?.finalTgC, '°C'],
    ['Peak part temperature', replay.summary.peakPartC, b?.peakPartC, '°C'],
    ['Peak exotherm overshoot', replay.summary.peakOvershootC, b?.peakOvershootC, '°C'],
    ['Largest through-thickness gradient', replay.summary.maxGradientC, b?.maxGradientC, '°C'],
    ['Warpage', replay.summary.warpageMm, b?.warpageMm, 'mm'],
    ['Spring-in', replay.summary.springInDeg, b?.springInDeg, '°'],
  ];
  return (
    <div data-testid="replay-results">
      <table className="mt-2 w-full border-collapse text-sm">
        <thead>
          <tr className="border-b border-rule text-left text-ink-soft">
            <th className="py-1 pr-2 font-medium">Predicted</th>
            <th className="py-1 pr-2 text-right font-medium">This run (replay)</th>
            <th className="py-1 pr-2 text-right font-medium" data-testid="baseline-name">{baselineLabel(record, baseline) ?? 'Baseline'}</th>
          </tr>
        </thead>
        <tbody>
          {rows.map(([label, value, base, unit]) => (
            <tr key={label} className="border-b border-rule/60">
              <td className="py-1 pr-2">{label}</td>
              <td className="num py-1 pr-2 text-right">{f(value)} {unit}</td>
              <td className="num py-1 pr-2 text-right">{base === undefined ? 'no baseline pinned' : `${f(base)} ${unit}`}</td>
            </tr>
          ))}
          <tr className="border-b border-rule/60">
            <td className="py-1 pr-2">Largest transverse ply stress after demould</td>
            <td className="num py-1 pr-2 text-right">{f(replay.maxTransverseStressMPa)} MPa</td>
            <td className="num py-1 pr-2 text-right">
              {!replay.baseline ? 'no baseline pinned' : baseStress === undefined ? 'not kept in this record' : `${f(baseStress)} MPa`}
            </td>
          </tr>
        </tbody>
      </table>
      <h4 className="mt-4 text-sm font-medium">At each thermocouple</h4>
      <table className="mt-1 w-full border-collapse text-sm" data-testid="replay-at-tcs">
        <thead>
          <tr className="border-b border-rule text-left text-ink-soft">
            <th className="py-1 pr-2 font-medium">Thermocouple</th>
            <th className="py-1 pr-2 font-medium">Position</th>
            <th className="py-1 pr-2 text-right font-medium">Final cure</th>
            <th className="py-1 pr-2 text-right font-medium">Final Tg</th>
            <th className="py-1 pr-2 text-right font-medium">Measured − predicted (RMS / worst)</th>
          </tr>
        </thead>
        <tbody>
          {replay.atTcs.map((t) => (
            <tr key={t.channel} className="border-b border-rule/60">
              <td className="py-1 pr-2">{t.channel}</td>
              <td className="py-1 pr-2">{t.position}</td>
              <td className="num py-1 pr-2 text-right">{f(t.finalCure)}</td>
              <td className="num py-1 pr-2 text-right">{t.finalTgC === null ? '—' : `${f(t.finalTgC)} °C`}</td>
              <td className="num py-1 pr-2 text-right">
                {t.rmsDifferenceC === null ? 'position unknown' : `${f(t.rmsDifferenceC, 2)} / ${f(t.maxDifferenceC, 2)} °C at ${f(t.maxDifferenceAtMin, 4)} min`}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="mt-1 text-xs text-ink-faint">
        A large measured − predicted difference says the model does not describe this part or tool well; weigh the replay accordingly.
        Model {replay.modelVersion}.
      </p>
    </div>
  );
}

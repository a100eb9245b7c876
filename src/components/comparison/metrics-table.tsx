import type { MetricComparison } from '../../../shared/compare/metric-deltas';
import { changeShows, formatChangeBetween, formatFigure, formatLimit, formatNumber } from './format-figure';

function Verdict({ pass }: { pass: boolean }) {
  return pass ? <span className="text-verdigris">pass</span> : <span className="font-semibold text-fault">FAIL</span>;
}

/** Key figures side by side with B − A, then each process limit with both verdicts and whether it flips. */
export function MetricsTable({ comparison, labelA, labelB }: { comparison: MetricComparison; labelA: string; labelB: string }) {
  const th = 'px-2 py-1 text-left text-[11px] font-semibold uppercase tracking-[0.06em] text-ink-soft';
  const td = 'px-2 py-1 num text-right whitespace-nowrap';
  return (
    <div className="flex flex-col gap-4">
      <table className="w-full border-collapse text-sm" data-testid="metrics-table">
        <caption className="sr-only">Key figures of A and B and the change from A to B</caption>
        <thead className="border-b border-rule">
          <tr>
            <th className={th} scope="col">Figure</th>
            <th className={`${th} text-right`} scope="col" title={labelA}>A</th>
            <th className={`${th} text-right`} scope="col" title={labelB}>B</th>
            <th className={`${th} text-right`} scope="col">Change B − A</th>
          </tr>
        </thead>
        <tbody>
          {comparison.metrics.map((m) => (
            <tr key={m.key} className="border-b border-rule/60" data-metric={m.key}>
              <th scope="row" className="px-2 py-1 text-left font-normal">{m.label}</th>
              <td className={td}>{formatFigure(m.a, m.unit)}</td>
              <td className={td}>{formatFigure(m.b, m.unit)}</td>
              <td className={`${td} ${changeShows(m.a, m.b, m.unit) ? 'font-semibold' : 'text-ink-faint'}`} data-testid={`delta-${m.key}`}>
                {formatChangeBetween(m.a, m.b, m.unit)}
              </td>
            </tr>
          ))}
        </tbody>
      </table>

      <table className="w-full border-collapse text-sm" data-testid="limits-table">
        <caption className="sr-only">Process limits: verdicts of A and B and which limits flip</caption>
        <thead className="border-b border-rule">
          <tr>
            <th className={th} scope="col">Process limit</th>
            <th className={`${th} text-right`} scope="col">Limit</th>
            <th className={`${th} text-right`} scope="col">A</th>
            <th className={`${th} text-right`} scope="col">B</th>
            <th className={th} scope="col">Verdict change</th>
          </tr>
        </thead>
        <tbody>
          {comparison.limits.map((l) => (
            <tr key={l.key} className={`border-b border-rule/60 ${l.flip === 'now-fails' ? 'bg-fault-soft' : l.flip === 'now-passes' ? 'bg-verdigris-soft' : ''}`} data-limit={l.key} data-flip={l.flip ?? 'none'}>
              <th scope="row" className="px-2 py-1 text-left font-normal">{l.label}</th>
              <td className={td}>
                {l.limitChanged && l.a ? `${formatLimit(l.key, l.a.limit, l.unit)} → ` : ''}
                {formatLimit(l.key, (l.b ?? l.a)!.limit, l.unit)}
              </td>
              <td className={td}>{l.a ? <>{formatNumber(l.a.value, l.unit)} <Verdict pass={l.a.pass} /></> : '—'}</td>
              <td className={td}>{l.b ? <>{formatNumber(l.b.value, l.unit)} <Verdict pass={l.b.pass} /></> : '—'}</td>
              <td className="px-2 py-1">
                {l.flip === 'now-fails' && <span className="font-semibold text-fault">✕ now fails</span>}
                {l.flip === 'now-passes' && <span className="font-semibold text-verdigris">✓ now passes</span>}
                {!l.flip && <span className="text-ink-faint">same</span>}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

import type { Finding } from '../../../../shared/run-log/index';

const SEVERITY_STYLE: Record<Finding['severity'], string> = {
  violation: 'bg-fault-soft text-fault',
  warning: 'bg-saffron-soft text-ink',
  note: 'bg-slate-soft text-ink-soft',
};

/** Rule keys in words, as a quality engineer would name them. */
export const RULE_LABELS: Record<string, string> = {
  'hygiene.dead': 'Dead channel',
  'hygiene.flat': 'Flat channel',
  'hygiene.noisy': 'Noisy channel',
  'hygiene.impossible': 'Impossible readings',
  'hygiene.missing': 'Missing readings',
  'hygiene.part-leads-air': 'Part TC leads the air',
  'hygiene.gap': 'Gap in the record',
  'hygiene.time-unit-inferred': 'Time unit not in the header',
  'hygiene.short-log': 'Short log',
  'spec.heat-rate': 'Heat-up rate',
  'spec.cool-rate': 'Cool-down rate',
  'spec.hold-long': 'Hold ran long',
  'spec.hold-short': 'Hold cut short',
  'spec.hold-band': 'Out of hold band',
  'spec.hold-not-reached': 'Hold not reached',
  'spec.max-temperature': 'Maximum temperature',
  'spec.pressure-window': 'Pressure window',
  'spec.pressure-not-reached': 'Pressure not reached',
  'spec.vacuum-window': 'Vacuum window',
  'spec.vacuum-not-reached': 'Vacuum not reached',
  'spec.cycle-time': 'Cycle time',
  'spec.no-part-tc': 'No part thermocouple',
  'spec.no-pressure': 'Pressure not checked',
  'spec.no-vacuum': 'Vacuum not checked',
};

const fmt = (v: number | null) => (v === null ? '—' : String(v));
const fmtMin = (f: Finding) => (f.untilMin !== null && f.untilMin !== f.atMin ? `${f.atMin}–${f.untilMin}` : String(f.atMin));

/** Findings with their channel and time stamp; an empty list says so in words. */
export function FindingsTable({ findings, empty, testId }: { findings: Finding[]; empty: string; testId: string }) {
  if (findings.length === 0) return <p className="mt-2 text-sm text-verdigris" data-testid={testId}>{empty}</p>;
  return (
    <table className="mt-2 w-full border-collapse text-sm" data-testid={testId}>
      <thead>
        <tr className="border-b border-rule text-left text-ink-soft">
          <th className="py-1 pr-2 font-medium">Severity</th>
          <th className="py-1 pr-2 font-medium">Finding</th>
          <th className="py-1 pr-2 font-medium">Channel</th>
          <th className="py-1 pr-2 font-medium">Time (min)</th>
          <th className="py-1 pr-2 text-right font-medium">Value</th>
          <th className="py-1 pr-2 text-right font-medium">Limit</th>
        </tr>
      </thead>
      <tbody>
        {findings.map((f, i) => (
          <tr key={`${f.rule}-${f.channel}-${i}`} className="border-b border-rule/60 align-top" data-rule={f.rule}>
            <td className="py-1 pr-2"><span className={`rounded px-1.5 py-0.5 text-xs ${SEVERITY_STYLE[f.severity]}`}>{f.severity}</span></td>
            <td className="py-1 pr-2">
              <span className="font-medium">{RULE_LABELS[f.rule] ?? f.rule}</span>
              <span className="block text-ink-soft">{f.message}</span>
            </td>
            <td className="py-1 pr-2">{f.channel}</td>
            <td className="num py-1 pr-2">{fmtMin(f)}</td>
            <td className="num py-1 pr-2 text-right">{fmt(f.value)} {f.value !== null ? f.unit : ''}</td>
            <td className="num py-1 pr-2 text-right">{fmt(f.limit)} {f.limit !== null ? f.unit : ''}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

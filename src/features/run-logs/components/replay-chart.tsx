import { useMemo } from 'react';
import type { PredictionTrace, RunLogRecord } from '../../../../shared/run-log/index';
import { LineChart, type ChartLine } from './line-chart';

// Measured part TCs (solid) against the replay's prediction at the same places (dashed) and the baseline
// revision's prediction (dotted), with the measured air in grey: the gap between solid and dashed lines is
// the model's own check; the gap between dashed and dotted is what this run did differently. Below it, the
// measured vessel pressure and bag vacuum, each on its own axis.

const POSITION_COLOUR: Record<string, string> = { 'bag-side': '#c9571f', 'mid-plane': '#2d7f73', 'tool-side': '#3e5c86', unknown: '#b7860b' };
const TRACE_KEY = { 'bag-side': 'bagC', 'mid-plane': 'midC', 'tool-side': 'toolSideC' } as const;

function traceLines(trace: PredictionTrace, positions: string[], prefix: string, dash: string): ChartLine[] {
  return positions
    .filter((p): p is keyof typeof TRACE_KEY => p in TRACE_KEY)
    .map((p) => ({ key: `${prefix}-${p}`, label: `${prefix} ${p}`, colour: POSITION_COLOUR[p], dash, xs: trace.timeMin, ys: trace[TRACE_KEY[p]] }));
}

export function ReplayChart({ record }: { record: RunLogRecord }) {
  const lines = useMemo(() => {
    const out: ChartLine[] = [];
    const air = record.channels.find((c) => c.role === 'air');
    if (air) out.push({ key: 'air', label: `measured ${air.label}`, colour: '#6b7587', width: 1, xs: record.chart.timeMin, ys: record.chart.channels[air.key] });
    const parts = record.channels.filter((c) => c.role === 'part');
    for (const c of parts) {
      out.push({ key: c.key, label: `measured ${c.label}`, colour: POSITION_COLOUR[c.position ?? 'unknown'], width: 2, xs: record.chart.timeMin, ys: record.chart.channels[c.key] });
    }
    const positions = [...new Set(parts.map((c) => c.position ?? 'unknown'))];
    if (record.replay) out.push(...traceLines(record.replay.predicted, positions, 'replay', '6 4'));
    if (record.replay?.baseline) out.push(...traceLines(record.replay.baseline.predicted, positions.includes('mid-plane') ? ['mid-plane'] : positions.slice(0, 1), 'baseline', '2 3'));
    return out;
  }, [record]);
  return <LineChart lines={lines} unit="°C" label="Measured part temperatures with the replay and baseline predictions" testId="replay-chart" />;
}

/** Measured vessel pressure (bar) and bag vacuum (kPa below atmosphere), one small chart each. */
export function GaugesChart({ record }: { record: RunLogRecord }) {
  const gauges = record.channels.filter((c) => c.role === 'pressure' || c.role === 'vacuum');
  if (gauges.length === 0) return <p className="mt-2 text-sm text-ink-soft" data-testid="gauges-chart">No pressure or vacuum channel in this log.</p>;
  return (
    <div data-testid="gauges-chart">
      {gauges.map((c) => {
        const pressure = c.role === 'pressure';
        const lines: ChartLine[] = [
          { key: c.key, label: `measured ${c.label} (${pressure ? 'bar gauge' : 'kPa below atmosphere'})`, colour: pressure ? '#3e5c86' : '#2d7f73', width: 1.5, xs: record.chart.timeMin, ys: record.chart.channels[c.key] },
        ];
        return (
          <LineChart
            key={c.key}
            lines={lines}
            unit={pressure ? 'bar' : 'kPa'}
            pad={pressure ? 0.5 : 5}
            height={170}
            label={pressure ? `Measured vessel pressure, ${c.label}` : `Measured bag vacuum, ${c.label}`}
            testId={`gauge-${c.role}`}
          />
        );
      })}
    </div>
  );
}

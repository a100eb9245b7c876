import { useMemo } from 'react';
import { scaleLinear } from 'd3-scale';
import { line } from 'd3-shape';
import type { PredictionTrace, RunLogRecord } from '../../../../shared/run-log/index';

// Measured part TCs (solid) against the replay's prediction at the same places (dashed) and the baseline
// revision's prediction (dotted), with the measured air in grey: the gap between solid and dashed lines is
// the model's own check; the gap between dashed and dotted is what this run did differently.

const W = 860;
const H = 300;
const M = { left: 48, right: 12, top: 12, bottom: 34 };
const POSITION_COLOUR: Record<string, string> = { 'bag-side': '#c9571f', 'mid-plane': '#2d7f73', 'tool-side': '#3e5c86', unknown: '#b7860b' };
const TRACE_KEY = { 'bag-side': 'bagC', 'mid-plane': 'midC', 'tool-side': 'toolSideC' } as const;

interface Line {
  key: string;
  label: string;
  colour: string;
  dash?: string;
  width?: number;
  xs: number[];
  ys: (number | null)[];
}

function traceLines(trace: PredictionTrace, positions: string[], prefix: string, dash: string): Line[] {
  return positions
    .filter((p): p is keyof typeof TRACE_KEY => p in TRACE_KEY)
    .map((p) => ({ key: `${prefix}-${p}`, label: `${prefix} ${p}`, colour: POSITION_COLOUR[p], dash, xs: trace.timeMin, ys: trace[TRACE_KEY[p]] }));
}

export function ReplayChart({ record }: { record: RunLogRecord }) {
  const lines = useMemo(() => {
    const out: Line[] = [];
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

  const { x, y, paths } = useMemo(() => {
    let tMax = 0;
    let lo = Infinity;
    let hi = -Infinity;
    for (const l of lines) {
      tMax = Math.max(tMax, l.xs[l.xs.length - 1] ?? 0);
      for (const v of l.ys) {
        if (v === null) continue;
        lo = Math.min(lo, v);
        hi = Math.max(hi, v);
      }
    }
    const x = scaleLinear().domain([0, tMax || 1]).range([M.left, W - M.right]);
    const y = scaleLinear().domain([Math.floor((lo - 5) / 10) * 10, Math.ceil((hi + 5) / 10) * 10]).range([H - M.bottom, M.top]).nice();
    const path = line<[number, number | null]>()
      .defined((d) => d[1] !== null)
      .x((d) => x(d[0]))
      .y((d) => y(d[1] as number));
    return { x, y, paths: lines.map((l) => ({ ...l, d: path(l.xs.map((t, i) => [t, l.ys[i]])) ?? '' })) };
  }, [lines]);

  return (
    <figure className="mt-3" data-testid="replay-chart">
      <svg viewBox={`0 0 ${W} ${H}`} className="w-full" role="img" aria-label="Measured part temperatures with the replay and baseline predictions">
        {y.ticks(6).map((v) => (
          <g key={v}>
            <line x1={M.left} x2={W - M.right} y1={y(v)} y2={y(v)} stroke="#d9d3c7" strokeWidth={0.5} />
            <text x={M.left - 6} y={y(v) + 4} textAnchor="end" fontSize={11} fill="#3a4557">{v}</text>
          </g>
        ))}
        {x.ticks(8).map((t) => (
          <text key={t} x={x(t)} y={H - M.bottom + 16} textAnchor="middle" fontSize={11} fill="#3a4557">{t}</text>
        ))}
        <text x={(M.left + W - M.right) / 2} y={H - 4} textAnchor="middle" fontSize={11} fill="#3a4557">time (min)</text>
        <text x={12} y={M.top + 8} fontSize={11} fill="#3a4557">°C</text>
        {paths.map((p) => (
          <path key={p.key} d={p.d} fill="none" stroke={p.colour} strokeWidth={p.width ?? 1.5} strokeDasharray={p.dash} data-series={p.key} />
        ))}
      </svg>
      <figcaption className="mt-1 flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-soft">
        {paths.map((p) => (
          <span key={p.key} className="inline-flex items-center gap-1">
            <svg width="22" height="6" aria-hidden="true"><line x1="0" x2="22" y1="3" y2="3" stroke={p.colour} strokeWidth={2} strokeDasharray={p.dash} /></svg>
            {p.label}
          </span>
        ))}
      </figcaption>
    </figure>
  );
}

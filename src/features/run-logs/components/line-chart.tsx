import { useMemo } from 'react';
import { scaleLinear } from 'd3-scale';
import { line } from 'd3-shape';

// A small time chart for the run-log pages: a few lines over minutes, one unit on the y axis, a legend
// that keeps each line's dash so it reads in greyscale and on paper.

export interface ChartLine {
  key: string;
  label: string;
  colour: string;
  dash?: string;
  width?: number;
  xs: number[];
  ys: (number | null)[];
}

const W = 860;
const M = { left: 48, right: 12, top: 12, bottom: 34 };

export function LineChart({ lines, unit, label, testId, height = 300, pad = 5 }: { lines: ChartLine[]; unit: string; label: string; testId: string; height?: number; pad?: number }) {
  const H = height;
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
    if (!(hi >= lo)) [lo, hi] = [0, 1];
    const x = scaleLinear().domain([0, tMax || 1]).range([M.left, W - M.right]);
    const y = scaleLinear().domain([lo - pad, hi + pad]).range([H - M.bottom, M.top]).nice();
    const path = line<[number, number | null]>()
      .defined((d) => d[1] !== null)
      .x((d) => x(d[0]))
      .y((d) => y(d[1] as number));
    return { x, y, paths: lines.map((l) => ({ ...l, d: path(l.xs.map((t, i) => [t, l.ys[i]])) ?? '' })) };
  }, [lines, H, pad]);

  return (
    <figure className="mt-3" data-testid={testId}>
      <svg viewBox={`0 0 ${W} ${H}`} className="w-full" role="img" aria-label={label}>
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
        <text x={12} y={M.top + 8} fontSize={11} fill="#3a4557">{unit}</text>
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

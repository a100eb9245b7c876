import { memo, useMemo } from 'react';
import { scaleLinear } from 'd3-scale';
import { ChartFigure, runsDescription } from './chart-figure';
import type { ResultRun } from './history-chart';
import { markerPath, RUN_STYLES } from './run-styles';
import { ValueTicks } from './time-axis';

type Component = 'sigma1Pa' | 'sigma2Pa' | 'tau12Pa';

export const STRESS_COMPONENTS: readonly { key: Component; label: string; colour: string }[] = [
  { key: 'sigma1Pa', label: 'σ₁ along fibre', colour: 'var(--color-slate)' },
  { key: 'sigma2Pa', label: 'σ₂ across fibre', colour: 'var(--color-ember)' },
  { key: 'tau12Pa', label: 'τ₁₂ in-plane shear', colour: 'var(--color-verdigris)' },
];

const M = { left: 40, right: 6, top: 16, bottom: 48 };
const GAP = 22;

/** The value of largest magnitude, in MPa, written so that a tiny negative never reads "-0.0". */
export function peakText(valuesPa: ArrayLike<number>): string {
  let peak = 0;
  for (let i = 0; i < valuesPa.length; i++) if (Math.abs(valuesPa[i]) > Math.abs(peak)) peak = valuesPa[i];
  const mpa = peak / 1e6;
  return Math.abs(mpa) < 0.05 ? '0.0' : mpa.toFixed(1);
}

/**
 * Final ply stresses in ply axes through the thickness (tool side at the bottom, blue rule), one strip per
 * component with its own symmetric scale. A single run fills each ply from the zero line out to its stress at
 * the ply's bottom and top; overlaid runs are outlines with their dash and a marker at each ply's mid-thickness.
 */
export const PlyStressChart = memo(function PlyStressChart({
  runs,
  width,
  height = 250,
  fileBase,
  className,
}: {
  runs: ResultRun[];
  width: number;
  height?: number;
  fileBase?: string;
  className?: string;
}) {
  const overlaid = runs.length > 1;
  const plotWidth = Math.max(3 * 40 + 2 * GAP, width - M.left - M.right);
  const stripWidth = (plotWidth - 2 * GAP) / 3;
  const ph = height - M.top - M.bottom;
  const scales = useMemo(() => {
    let zTop = 0;
    for (const r of runs) {
      const z = r.result.plyStresses.zM;
      if (z.length) zTop = Math.max(zTop, z[z.length - 1] * 1000);
    }
    const y = scaleLinear().domain([0, zTop || 1]).range([ph, 0]);
    const x = STRESS_COMPONENTS.map((c) => {
      let lim = 1;
      for (const r of runs) for (const v of r.result.plyStresses[c.key]) lim = Math.max(lim, Math.abs(v) / 1e6);
      return scaleLinear().domain([-lim, lim]).range([0, stripWidth]).nice(stripWidth > 150 ? 4 : 2);
    });
    return { x, y };
  }, [runs, stripWidth, ph]);
  const { y } = scales;
  // The workspace's narrow column: smaller words under each strip so neighbours' labels do not run together.
  const labelSize = stripWidth < 110 ? 9 : 10;
  const runLabels = runs.map((r) => r.label);
  const letter = (r: number) => (overlaid ? `${RUN_STYLES[r].letter} ` : '');
  const peaks = STRESS_COMPONENTS.map((c) => runs.map((r, i) => `${letter(i)}${peakText(r.result.plyStresses[c.key])}`).join(' · '));
  const ariaPeaks = STRESS_COMPONENTS.map((c, k) => `${c.label} peak ${peaks[k]} MPa`).join('; ');

  return (
    <ChartFigure
      title="Final ply stresses"
      legend={[]}
      runLabels={runLabels}
      width={width}
      height={height}
      ariaLabel={`Final ply stresses through the thickness${runsDescription(runLabels)}: ${ariaPeaks}`}
      fileBase={fileBase}
      testId="chart-ply-stress"
      className={className}
    >
      <g transform={`translate(${M.left},${M.top})`}>
        <ValueTicks y={y} width={plotWidth} unit="z, mm" count={3} />
        {STRESS_COMPONENTS.map((c, k) => {
          const x = scales.x[k];
          return (
            <g key={c.key} transform={`translate(${k * (stripWidth + GAP)},0)`}>
              <line x1={x(0)} x2={x(0)} y1={0} y2={ph} stroke="var(--color-ink-faint)" />
              <line x1={0} x2={stripWidth} y1={ph} y2={ph} stroke="var(--color-slate)" strokeWidth={2} />
              {runs.map((run, r) => {
                const style = RUN_STYLES[r];
                const s = run.result.plyStresses;
                const values = s[c.key];
                const zMm = (i: number) => s.zM[i] * 1000;
                if (!overlaid) {
                  let d = '';
                  // Each ply as a closed shape from the zero line out to its stress at bottom and top.
                  for (let i = 0; i + 1 < values.length; i += 2) {
                    d += `M${x(0)},${y(zMm(i))}L${x(values[i] / 1e6)},${y(zMm(i))}L${x(values[i + 1] / 1e6)},${y(zMm(i + 1))}L${x(0)},${y(zMm(i + 1))}Z`;
                  }
                  return <path key={r} data-run={style.letter} d={d} fill={c.colour} fillOpacity={0.3} stroke={c.colour} strokeWidth={1} />;
                }
                let d = '';
                for (let i = 0; i < values.length; i++) d += `${i === 0 ? 'M' : 'L'}${x(values[i] / 1e6)},${y(zMm(i))}`;
                const mids: [number, number][] = [];
                for (let i = 0; i + 1 < values.length; i += 2) mids.push([(values[i] + values[i + 1]) / 2e6, (zMm(i) + zMm(i + 1)) / 2]);
                // Thick laminates: a marker on every few plies is enough.
                const every = Math.max(1, Math.ceil(mids.length / 12));
                return (
                  <g key={r} data-run={style.letter}>
                    <path d={d} fill="none" stroke={c.colour} strokeWidth={1.4} strokeDasharray={style.dash} />
                    {mids
                      .filter((_, m) => m % every === r % every)
                      .map(([v, z], m) => (
                        <path key={m} d={markerPath(style.marker, 6)} transform={`translate(${x(v)},${y(z)})`} fill="var(--color-paper-raised)" stroke={c.colour} strokeWidth={1.2} />
                      ))}
                  </g>
                );
              })}
              {x.ticks(stripWidth > 150 ? 4 : 2).map((t) => (
                <text key={t} x={x(t)} y={ph + 12} textAnchor="middle" fontSize={9} className="num" fill="currentColor">
                  {t}
                </text>
              ))}
              <text x={stripWidth / 2} y={ph + 26} textAnchor="middle" fontSize={labelSize} fill="var(--color-ink-soft)">
                {c.label}
              </text>
              <text x={stripWidth / 2} y={ph + 39} textAnchor="middle" fontSize={labelSize} className="num" fill="var(--color-ink-soft)">
                peak {peaks[k]} MPa
              </text>
            </g>
          );
        })}
      </g>
    </ChartFigure>
  );
});

import { memo } from 'react';
import { scaleLinear } from 'd3-scale';
import type { SimulationResult } from '../../model/simulation-result';
import { useResults } from '../../stores/results-store';

const W = 104;
const H = 190;
const M = { left: 8, right: 8, top: 8, bottom: 30 };

type Component = { key: 'sigma1Pa' | 'sigma2Pa' | 'tau12Pa'; label: string; colour: string };

const COMPONENTS: Component[] = [
  { key: 'sigma1Pa', label: 'σ₁ along fibre', colour: 'var(--color-slate)' },
  { key: 'sigma2Pa', label: 'σ₂ across fibre', colour: 'var(--color-ember)' },
  { key: 'tau12Pa', label: 'τ₁₂ in-plane shear', colour: 'var(--color-verdigris)' },
];

function StressStrip({ result, c, zTopMm }: { result: SimulationResult; c: Component; zTopMm: number }) {
  const s = result.plyStresses;
  const values = Array.from(s[c.key], (v) => v / 1e6);
  const lim = Math.max(1, ...values.map(Math.abs));
  const pw = W - M.left - M.right;
  const ph = H - M.top - M.bottom;
  const x = scaleLinear().domain([-lim, lim]).range([0, pw]).nice(2);
  const y = scaleLinear().domain([0, zTopMm]).range([ph, 0]);
  const segments: string[] = [];
  for (let i = 0; i + 1 < values.length; i += 2) {
    const z0 = s.zM[i] * 1000;
    const z1 = s.zM[i + 1] * 1000;
    // Each ply as a closed shape from the zero line out to its stress at bottom and top.
    segments.push(`M${x(0)},${y(z0)}L${x(values[i])},${y(z0)}L${x(values[i + 1])},${y(z1)}L${x(0)},${y(z1)}Z`);
  }
  const peak = values.reduce((m, v) => (Math.abs(v) > Math.abs(m) ? v : m), 0);
  const peakText = Math.abs(peak) < 0.05 ? '0.0' : peak.toFixed(1);
  return (
    <figure className="flex flex-col items-center">
      <svg width={W} height={H} role="img" aria-label={`${c.label} through the thickness, peak ${peakText} MPa`}>
        <g transform={`translate(${M.left},${M.top})`}>
          <line x1={x(0)} x2={x(0)} y1={0} y2={ph} stroke="var(--color-ink-faint)" />
          <path d={segments.join('')} fill={c.colour} fillOpacity={0.3} stroke={c.colour} strokeWidth={1} />
          <line x1={0} x2={pw} y1={ph} y2={ph} stroke="var(--color-slate)" strokeWidth={2} />
          {x.ticks(2).map((t) => (
            <text key={t} x={x(t)} y={ph + 12} textAnchor="middle" fontSize={9} className="num" fill="var(--color-ink-faint)">
              {t}
            </text>
          ))}
          <text x={pw / 2} y={ph + 24} textAnchor="middle" fontSize={9} fill="var(--color-ink-faint)">
            MPa
          </text>
        </g>
      </svg>
      <figcaption className="text-center text-[11px] leading-tight text-ink-soft">
        {c.label}
        <span className="num block">peak {peakText} MPa</span>
      </figcaption>
    </figure>
  );
}

/** Residual ply stresses after demould, in ply axes, each ply drawn bottom (tool side) to top. */
export const PlyStressChart = memo(function PlyStressChart() {
  const result = useResults((s) => s.result);
  if (!result || result.plyStresses.zM.length === 0) return <p className="text-sm text-ink-faint">No stresses yet.</p>;
  const zTopMm = result.plyStresses.zM[result.plyStresses.zM.length - 1] * 1000;
  return (
    <div className="flex justify-between" data-testid="ply-stress">
      {COMPONENTS.map((c) => (
        <StressStrip key={c.key} result={result} c={c} zTopMm={zTopMm} />
      ))}
    </div>
  );
});

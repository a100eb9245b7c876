import { forwardRef, useMemo } from 'react';
import { scaleLinear } from 'd3-scale';
import type { SimulationResult } from '../../../shared/solver/simulation-result';
import { ValueTicks } from '../charts/time-axis';
import { markerPath, RUN_STYLES } from './run-styles';

export interface StressRun {
  label: string;
  plyStresses: SimulationResult['plyStresses'];
}

type Component = 'sigma1Pa' | 'sigma2Pa' | 'tau12Pa';

export const STRESS_COMPONENTS: readonly { key: Component; label: string; colour: string }[] = [
  { key: 'sigma1Pa', label: 'σ1 along the fibre', colour: 'var(--color-slate)' },
  { key: 'sigma2Pa', label: 'σ2 across the fibre', colour: 'var(--color-ember)' },
  { key: 'tau12Pa', label: 'τ12 in-plane shear', colour: 'var(--color-verdigris)' },
];

const HEIGHT = 260;
const M = { left: 52, right: 14, top: 14, bottom: 34 };

/**
 * Final ply stresses through the thickness (z from the tool side up) for one or more runs: each ply's
 * bottom and top values joined, so a jump between plies shows as a horizontal step. Runs keep their dash and
 * marker (a marker at every ply's mid-thickness).
 */
export const PlyStressProfileChart = forwardRef<SVGSVGElement, { runs: StressRun[]; width: number; testId?: string }>(
  function PlyStressProfileChart({ runs, width, testId }, ref) {
    const pw = Math.max(60, width - M.left - M.right);
    const ph = HEIGHT - M.top - M.bottom;
    const { x, y } = useMemo(() => {
      let lim = 1;
      let zTop = 0;
      for (const r of runs) {
        for (const c of STRESS_COMPONENTS) for (const v of r.plyStresses[c.key]) lim = Math.max(lim, Math.abs(v) / 1e6);
        const z = r.plyStresses.zM;
        if (z.length) zTop = Math.max(zTop, z[z.length - 1] * 1000);
      }
      return {
        x: scaleLinear().domain([-lim, lim]).range([0, pw]).nice(4),
        y: scaleLinear().domain([0, zTop || 1]).range([ph, 0]).nice(4),
      };
    }, [runs, pw, ph]);

    return (
      <figure className="break-inside-avoid" data-testid={testId}>
        <figcaption className="flex flex-wrap items-center gap-x-3 px-1 pb-1 text-xs text-ink-soft">
          <span className="text-[11px] font-semibold uppercase tracking-[0.08em]">Final ply stresses</span>
          {STRESS_COMPONENTS.map((c) => (
            <span key={c.key} className="flex items-center gap-1">
              <svg width="14" height="8" aria-hidden>
                <rect y="2" width="14" height="4" fill={c.colour} />
              </svg>
              {c.label}
            </span>
          ))}
        </figcaption>
        <svg ref={ref} width={width} height={HEIGHT} role="img" aria-label="Final ply stresses through the thickness" className="block text-ink-faint" fontFamily="IBM Plex Sans, sans-serif">
          <g transform={`translate(${M.left},${M.top})`}>
            <ValueTicks y={y} width={pw} unit="z, mm" count={4} />
            {x.ticks(6).map((t) => (
              <g key={t} transform={`translate(${x(t)},0)`}>
                <line y1={0} y2={ph} stroke="var(--color-rule)" strokeWidth={t === 0 ? 1.2 : 0.6} />
                <text y={ph + 12} textAnchor="middle" fontSize={10} fill="currentColor" className="num">
                  {t}
                </text>
              </g>
            ))}
            <text x={pw} y={ph + 26} textAnchor="end" fontSize={10} fill="currentColor">
              stress, MPa (tension +)
            </text>
            {runs.map((run, r) => {
              const style = RUN_STYLES[r];
              const s = run.plyStresses;
              return (
                <g key={r} data-run={style.letter}>
                  {STRESS_COMPONENTS.map((c) => {
                    const values = s[c.key];
                    let d = '';
                    for (let i = 0; i < values.length; i++) {
                      d += `${i === 0 ? 'M' : 'L'}${x(values[i] / 1e6)},${y(s.zM[i] * 1000)}`;
                    }
                    const mids: [number, number][] = [];
                    if (runs.length > 1) {
                      for (let i = 0; i + 1 < values.length; i += 2) {
                        mids.push([(values[i] + values[i + 1]) / 2e6, ((s.zM[i] + s.zM[i + 1]) / 2) * 1000]);
                      }
                    }
                    // Thick laminates: a marker on every few plies is enough.
                    const every = Math.max(1, Math.ceil(mids.length / 12));
                    return (
                      <g key={c.key}>
                        <path d={d} fill="none" stroke={c.colour} strokeWidth={1.4} strokeDasharray={style.dash} />
                        {mids
                          .filter((_, k) => k % every === (r % every))
                          .map(([v, z], k) => (
                            <path key={k} d={markerPath(style.marker, 6)} transform={`translate(${x(v)},${y(z)})`} fill="var(--color-paper-raised)" stroke={c.colour} strokeWidth={1.2} />
                          ))}
                      </g>
                    );
                  })}
                </g>
              );
            })}
          </g>
        </svg>
      </figure>
    );
  },
);

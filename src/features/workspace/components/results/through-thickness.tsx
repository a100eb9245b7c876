import { memo, useMemo } from 'react';
import { ZERO_CELSIUS_K } from '../../../../../shared/units';
import { scaleLinear } from 'd3-scale';
import { line } from 'd3-shape';
import { indexAtOrBefore } from '../../../../components/charts/series-path';
import type { SimulationResult } from '../../model/simulation-result';
import { useResults } from '../../stores/results-store';

const W = 150;
const H = 170;
const M = { left: 34, right: 8, top: 8, bottom: 28 };

type Profile = { zMm: number[]; values: number[] };

/** Temperature and cure through the laminate at one step (rows of the steps×nodes profile arrays). */
export function profileAt(result: SimulationResult, step: number): { temperatureC: Profile; alpha: Profile } {
  const z = result.profiles.zM;
  const n = z.length;
  const zMm = Array.from(z, (v) => v * 1000);
  const row = (a: Float64Array, off: number) => Array.from(a.subarray(step * n, step * n + n), (v) => v + off);
  return {
    temperatureC: { zMm, values: row(result.profiles.temperatureK, -ZERO_CELSIUS_K) },
    alpha: { zMm, values: row(result.profiles.alpha, 0) },
  };
}

function ProfilePlot({
  title,
  unit,
  profile,
  domain,
  colour,
  focusZMm,
  format,
}: {
  title: string;
  unit: string;
  profile: Profile;
  domain: [number, number];
  colour: string;
  focusZMm: number | null;
  format: (v: number) => string;
}) {
  const pw = W - M.left - M.right;
  const ph = H - M.top - M.bottom;
  const zTop = profile.zMm[profile.zMm.length - 1] ?? 1;
  const x = scaleLinear().domain(domain).range([0, pw]).nice(3);
  const y = scaleLinear().domain([0, zTop]).range([ph, 0]);
  const d = line<number>().x((i) => x(profile.values[i])).y((i) => y(profile.zMm[i]))(profile.values.map((_, i) => i)) ?? '';
  return (
    <figure>
      <svg width={W} height={H} role="img" aria-label={`${title} through the thickness`}>
        <g transform={`translate(${M.left},${M.top})`}>
          {x.ticks(3).map((t) => (
            <g key={t} transform={`translate(${x(t)},0)`}>
              <line y1={0} y2={ph} stroke="var(--color-rule)" strokeWidth={0.6} />
              <text y={ph + 12} textAnchor="middle" fontSize={9} className="num" fill="var(--color-ink-faint)">
                {format(t)}
              </text>
            </g>
          ))}
          <text x={pw} y={ph + 24} textAnchor="end" fontSize={9} fill="var(--color-ink-faint)">
            {title}, {unit}
          </text>
          {y.ticks(3).map((t) => (
            <text key={t} x={-4} y={y(t)} dy="0.32em" textAnchor="end" fontSize={9} className="num" fill="var(--color-ink-faint)">
              {t}
            </text>
          ))}
          <line x1={0} x2={pw} y1={ph} y2={ph} stroke="var(--color-slate)" strokeWidth={2} />
          {focusZMm !== null && (
            <line x1={0} x2={pw} y1={y(focusZMm)} y2={y(focusZMm)} stroke="var(--color-fault)" strokeDasharray="3 2" />
          )}
          <path d={d} fill="none" stroke={colour} strokeWidth={2} />
        </g>
      </svg>
    </figure>
  );
}

/** Profiles at the scrubbed time: the laminate stands upright, tool side at the bottom. */
export const ThroughThickness = memo(function ThroughThickness() {
  const result = useResults((s) => s.result);
  const scrubMin = useResults((s) => s.scrubMin);
  const focusZMm = useResults((s) => s.focusZMm);
  const step = result ? indexAtOrBefore(result.history.timeS, scrubMin * 60) : 0;
  const profile = useMemo(() => (result && result.profiles.temperatureK.length ? profileAt(result, step) : null), [result, step]);
  if (!result || !profile) return <p className="text-sm text-ink-faint">No profiles yet.</p>;
  const tMin = Math.min(...profile.temperatureC.values);
  const tMax = Math.max(...profile.temperatureC.values);
  const pad = Math.max(2, (tMax - tMin) * 0.2);
  const mid = Math.floor(profile.temperatureC.values.length / 2);
  return (
    <div data-testid="through-thickness">
      <p className="num mb-1 text-xs text-ink-soft">
        at {(result.history.timeS[step] / 60).toFixed(1)} min · ΔT {(tMax - tMin).toFixed(1)} °C · mid-plane{' '}
        {profile.temperatureC.values[mid].toFixed(1)} °C, α {profile.alpha.values[mid].toFixed(3)}
      </p>
      <div className="flex gap-1">
        <ProfilePlot
          title="temperature"
          unit="°C"
          profile={profile.temperatureC}
          domain={[tMin - pad, tMax + pad]}
          colour="var(--color-ember)"
          focusZMm={focusZMm}
          format={(v) => v.toFixed(0)}
        />
        <ProfilePlot
          title="degree of cure"
          unit="α"
          profile={profile.alpha}
          domain={[0, 1]}
          colour="var(--color-verdigris)"
          focusZMm={focusZMm}
          format={(v) => v.toFixed(1)}
        />
      </div>
      <p className="text-[10px] text-ink-faint">z in mm from the tool face (blue rule) upward to the bag.</p>
    </div>
  );
});

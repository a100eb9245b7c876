import { memo, useMemo } from 'react';
import { scaleLinear } from 'd3-scale';
import { kToC } from '../../../shared/units';
import type { SimulationResult } from '../../../shared/solver/simulation-result';
import { ChartFigure, runsDescription } from './chart-figure';
import type { ResultRun } from './history-chart';
import { markerPath, RUN_STYLES } from './run-styles';
import { indexAtOrBefore } from './series-path';

export type Profile = { zMm: number[]; values: number[] };

/** Temperature (°C) and cure through the laminate at one step (rows of the steps×nodes profile arrays). */
export function profileAt(result: SimulationResult, step: number): { temperatureC: Profile; alpha: Profile } {
  const z = result.profiles.zM;
  const n = z.length;
  const zMm = Array.from(z, (v) => v * 1000);
  const row = (a: Float64Array, convert: (v: number) => number) => Array.from(a.subarray(step * n, step * n + n), convert);
  return {
    temperatureC: { zMm, values: row(result.profiles.temperatureK, kToC) },
    alpha: { zMm, values: row(result.profiles.alpha, (v) => v) },
  };
}

/** The step of `result` at or before `minutes`. */
export function stepAt(result: SimulationResult, minutes: number): number {
  return indexAtOrBefore(result.history.timeS, minutes * 60);
}

const M = { left: 34, right: 8, top: 8, bottom: 28 };

/**
 * One quantity through the thickness (z upward from the tool face, blue rule) for one or more runs at the
 * same time; overlaid runs keep their dash and marker (RUN_STYLES).
 */
export const ProfileChart = memo(function ProfileChart({
  title,
  quantity,
  unit,
  profiles,
  runLabels,
  domain,
  colour,
  format,
  focusZMm = null,
  width = 150,
  height = 170,
  fileBase,
  testId,
}: {
  title: string;
  /** the quantity under the horizontal axis, before its unit */
  quantity: string;
  unit: string;
  /** one per run, in RUN_STYLES order */
  profiles: Profile[];
  runLabels: string[];
  domain: [number, number];
  colour: string;
  format: (v: number) => string;
  focusZMm?: number | null;
  width?: number;
  height?: number;
  fileBase?: string;
  testId?: string;
}) {
  const pw = width - M.left - M.right;
  const ph = height - M.top - M.bottom;
  const overlaid = profiles.length > 1;
  const zTop = Math.max(1e-6, ...profiles.map((p) => p.zMm[p.zMm.length - 1] ?? 0));
  const x = scaleLinear().domain(domain).range([0, pw]).nice(3);
  const y = scaleLinear().domain([0, zTop]).range([ph, 0]);
  // The figure keeps to the chart's width (its caption wraps) so two profiles sit side by side.
  return (
    <div style={{ width }} className="shrink-0">
      <ChartFigure
        title={title}
        legend={[]}
        runLabels={runLabels}
        width={width}
        height={height}
        ariaLabel={`${title} through the thickness${runsDescription(runLabels)}`}
        fileBase={fileBase}
        testId={testId}
      >
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
            {quantity}, {unit}
          </text>
          {y.ticks(3).map((t) => (
            <text key={t} x={-4} y={y(t)} dy="0.32em" textAnchor="end" fontSize={9} className="num" fill="var(--color-ink-faint)">
              {t}
            </text>
          ))}
          <text x={-4} y={ph + 24} textAnchor="end" fontSize={9} fill="var(--color-ink-faint)">
            z, mm
          </text>
          <line x1={0} x2={pw} y1={ph} y2={ph} stroke="var(--color-slate)" strokeWidth={2} />
          {focusZMm !== null && <line x1={0} x2={pw} y1={y(focusZMm)} y2={y(focusZMm)} stroke="var(--color-fault)" strokeDasharray="3 2" />}
          {profiles.map((p, r) => {
            const style = RUN_STYLES[r];
            const d = p.values.map((v, i) => `${i ? 'L' : 'M'}${x(v)},${y(p.zMm[i])}`).join('');
            // A marker every few nodes, offset per run, so overlaid lines read apart in greyscale.
            const every = Math.max(1, Math.ceil(p.values.length / 6));
            return (
              <g key={r} data-run={style.letter}>
                <path d={d} fill="none" stroke={colour} strokeWidth={overlaid ? 1.6 : 2} strokeDasharray={style.dash} />
                {overlaid &&
                  p.values
                    .map((v, i) => [v, i] as const)
                    .filter(([, i]) => i % every === (r * Math.ceil(every / 2)) % every)
                    .map(([v, i]) => (
                      <path key={i} d={markerPath(style.marker, 6)} transform={`translate(${x(v)},${y(p.zMm[i])})`} fill="var(--color-paper-raised)" stroke={colour} strokeWidth={1.2} />
                    ))}
              </g>
            );
          })}
        </g>
      </ChartFigure>
    </div>
  );
});

/** Range of a profile's values with some air around it (at least ±2 °C, so a flat profile is still a line). */
function paddedRange(profiles: Profile[]): [number, number] {
  const all = profiles.flatMap((p) => p.values);
  const lo = Math.min(...all);
  const hi = Math.max(...all);
  const pad = Math.max(2, (hi - lo) * 0.2);
  return [lo - pad, hi + pad];
}

/**
 * Temperature and degree of cure through the thickness of each run at `minutes`, side by side, each with its
 * SVG/PNG export. The workspace shows its one run at the scrubbed time; the compare view overlays two.
 */
export function ThroughThicknessCharts({
  runs,
  minutes,
  focusZMm = null,
  width = 150,
  fileBase,
}: {
  runs: ResultRun[];
  minutes: number;
  focusZMm?: number | null;
  width?: number;
  fileBase?: string;
}) {
  const profiles = useMemo(
    () => runs.filter((r) => r.result.profiles.temperatureK.length > 0).map((r) => profileAt(r.result, stepAt(r.result, minutes))),
    [runs, minutes],
  );
  if (profiles.length === 0) return null;
  const runLabels = runs.map((r) => r.label);
  const temperatures = profiles.map((p) => p.temperatureC);
  const cures = profiles.map((p) => p.alpha);
  return (
    <div className="flex flex-wrap gap-1" data-testid="through-thickness-charts">
      <ProfileChart
        title="Temperature profile"
        quantity="temperature"
        unit="°C"
        profiles={temperatures}
        runLabels={runLabels}
        domain={paddedRange(temperatures)}
        colour="var(--color-ember)"
        format={(v) => v.toFixed(0)}
        focusZMm={focusZMm}
        width={width}
        fileBase={fileBase}
        testId="profile-temperature"
      />
      <ProfileChart
        title="Cure profile"
        quantity="degree of cure"
        unit="α"
        profiles={cures}
        runLabels={runLabels}
        domain={[0, 1]}
        colour="var(--color-verdigris)"
        format={(v) => v.toFixed(1)}
        focusZMm={focusZMm}
        width={width}
        fileBase={fileBase}
        testId="profile-cure"
      />
    </div>
  );
}

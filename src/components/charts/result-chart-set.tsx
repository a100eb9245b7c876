import { useMemo, useState } from 'react';
import { defaultExaggeration, EXAGGERATION_RANGE } from './exaggeration';
import type { ResultRun } from './history-chart';
import { PlyStressChart } from './ply-stress-chart';
import { CureChart, GlassChart, ModulusChart, TemperatureChart } from './result-charts';
import { ShapeChart, type ShapeRun } from './shape-chart';
import { ThroughThicknessCharts } from './through-thickness-chart';
import { makeTimeAxis, niceCycleEnd } from './time-axis';

/** The designed geometry a run's shape is drawn against (the study's strip span and corner angle). */
export type RunGeometry = { stripSpanMm: number; cornerAngleDeg: number };

const SHAPE_WIDTH = 360;

/**
 * Every result chart of one run or of a comparison (runs overlaid on one time axis from 0 to the longer
 * cycle), each with SVG and PNG export: the histories, the profiles through the thickness at a time the
 * reader picks (gelation of the first run to start with, where the profiles differ most), the final ply
 * stresses and the shape after demould. The compare view and the printable report show this set.
 */
export function ResultChartSet({
  runs,
  geometries,
  width,
  fileBase,
}: {
  runs: ResultRun[];
  /** per run, in the same order; without them the shape is not drawn */
  geometries?: RunGeometry[];
  width: number;
  fileBase: string;
}) {
  const lastMin = Math.max(...runs.map((r) => r.result.history.timeS[r.result.history.timeS.length - 1] / 60));
  const endMin = niceCycleEnd(lastMin);
  const axis = useMemo(() => makeTimeAxis([0, endMin], width), [endMin, width]);
  const firstGel = runs[0]?.result.summary.gelTimeMin ?? -1;
  const [profileMin, setProfileMin] = useState(() => Math.round(firstGel >= 0 ? firstGel : lastMin / 2));
  const shapes = useMemo<ShapeRun[]>(
    () =>
      geometries
        ? runs.map((r, i) => ({
            label: r.label,
            kxPerM: r.result.curvature.kx,
            springInDeg: r.result.summary.springInDeg,
            stripSpanMm: geometries[i].stripSpanMm,
            cornerAngleDeg: geometries[i].cornerAngleDeg,
          }))
        : [],
    [runs, geometries],
  );
  // One factor for all runs so their shapes compare: the one that shows the largest shape at about 25 px.
  const [factor, setFactor] = useState(() =>
    Math.min(
      ...runs.map((r) => defaultExaggeration(r.result.summary.warpageMm, r.result.summary.springInDeg, (SHAPE_WIDTH - 20) / (geometries?.[0]?.stripSpanMm ?? 300))),
    ),
  );
  const common = { runs, axis, fileBase };
  const profileWidth = Math.max(150, Math.min(300, Math.floor((width - 8) / 2)));
  return (
    <div className="flex flex-col gap-4" data-testid="run-charts">
      <TemperatureChart {...common} />
      <CureChart {...common} />
      <GlassChart {...common} />
      <ModulusChart {...common} />
      <div className="flex flex-col gap-1" data-testid="profiles-overlay">
        <label className="flex items-center gap-2 text-xs text-ink-soft print:hidden">
          Profiles through the thickness at
          <input
            type="range"
            min={0}
            max={Math.floor(lastMin)}
            step={1}
            value={profileMin}
            onChange={(e) => setProfileMin(Number(e.target.value))}
            className="flex-1 accent-slate"
            aria-valuetext={`${profileMin} min`}
            data-testid="profile-time"
          />
        </label>
        <p className="num text-xs text-ink-soft">Through the thickness at {profileMin} min (z from the tool face, blue rule, up to the bag)</p>
        <ThroughThicknessCharts runs={runs} minutes={profileMin} width={profileWidth} fileBase={fileBase} />
      </div>
      <PlyStressChart runs={runs} width={width} fileBase={fileBase} />
      {shapes.length > 0 && (
        <div className="flex flex-col gap-1">
          <ShapeChart runs={shapes} factor={factor} width={SHAPE_WIDTH} fileBase={fileBase} />
          <label className="flex max-w-[360px] items-center gap-2 text-xs text-ink-soft print:hidden">
            Exaggeration
            {/* A logarithmic slider: 0 → ×1, 3 → ×1000. */}
            <input
              type="range"
              min={Math.log10(EXAGGERATION_RANGE[0])}
              max={Math.log10(EXAGGERATION_RANGE[1])}
              step={0.05}
              value={Math.log10(factor)}
              onChange={(e) => setFactor(Math.round(10 ** Number(e.target.value)))}
              className="flex-1 accent-slate"
              aria-valuetext={`${factor} times`}
            />
            <span className="num w-14 text-right">×{factor}</span>
          </label>
        </div>
      )}
    </div>
  );
}

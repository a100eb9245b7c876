import { useMemo } from 'react';
import type { ResultRun } from './history-chart';
import { PlyStressChart } from './ply-stress-chart';
import { CureChart, GlassChart, ModulusChart, TemperatureChart } from './result-charts';
import { makeTimeAxis, niceCycleEnd } from './time-axis';

/**
 * Every result chart of one run or of a comparison (runs overlaid on one time axis from 0 to the longer
 * cycle), each with SVG and PNG export. The compare view and the printable report show this set.
 */
export function ResultChartSet({ runs, width, fileBase }: { runs: ResultRun[]; width: number; fileBase: string }) {
  const endMin = niceCycleEnd(Math.max(...runs.map((r) => r.result.history.timeS[r.result.history.timeS.length - 1] / 60)));
  const axis = useMemo(() => makeTimeAxis([0, endMin], width), [endMin, width]);
  const common = { runs, axis, fileBase };
  return (
    <div className="flex flex-col gap-4" data-testid="run-charts">
      <TemperatureChart {...common} />
      <CureChart {...common} />
      <GlassChart {...common} />
      <ModulusChart {...common} />
      <PlyStressChart runs={runs} width={width} fileBase={fileBase} />
    </div>
  );
}

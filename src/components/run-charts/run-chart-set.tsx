import { useRef, type ReactNode } from 'react';
import type { SimulationResult } from '../../../shared/solver/simulation-result';
import { niceCycleEnd } from '../charts/time-axis';
import { ChartExportControl } from '../export/chart-export-control';
import { fileSlug } from '../../lib/chart-export';
import { PlyStressProfileChart } from './ply-stress-profile-chart';
import { RunHistoryChart, type HistorySeries } from './run-history-chart';

const K0 = 273.15;
const toC = (k: number) => k - K0;
const same = (v: number) => v;

export const TEMPERATURE_SERIES: HistorySeries[] = [
  { label: 'air', colour: 'var(--color-ink-soft)', pick: (h) => h.airK, toDisplay: toC, strokeWidth: 1.1 },
  { label: 'part mid-plane', colour: 'var(--color-ember)', pick: (h) => h.midPlaneK, toDisplay: toC },
];
export const CURE_SERIES: HistorySeries[] = [
  { label: 'least cured point', colour: 'var(--color-verdigris)', pick: (h) => h.alphaMin, toDisplay: same },
];
export const TG_SERIES: HistorySeries[] = [
  { label: 'Tg at mid-plane', colour: 'var(--color-slate)', pick: (h) => h.tgMidK, toDisplay: toC },
];
export const MODULUS_SERIES: HistorySeries[] = [
  { label: 'resin at mid-plane', colour: 'var(--color-ink)', pick: (h) => h.resinModulusMidPa, toDisplay: (pa) => pa / 1e9 },
];

export interface ResultRun {
  label: string;
  result: SimulationResult;
}

function Framed({ children, title, fileBase, target }: { children: ReactNode; title: string; fileBase: string; target: React.RefObject<SVGSVGElement | null> }) {
  return (
    <div className="relative">
      <div className="absolute right-1 top-0">
        <ChartExportControl target={target} fileBase={`${fileBase}-${fileSlug(title)}`} title={title} />
      </div>
      {children}
    </div>
  );
}

/**
 * The result charts of one run or of a comparison (runs overlaid, one time axis from 0 to the longer
 * cycle), each with SVG and PNG export. Used by the compare view and the printable report.
 */
export function RunChartSet({ runs, width, fileBase }: { runs: ResultRun[]; width: number; fileBase: string }) {
  const temperature = useRef<SVGSVGElement>(null);
  const cure = useRef<SVGSVGElement>(null);
  const tg = useRef<SVGSVGElement>(null);
  const modulus = useRef<SVGSVGElement>(null);
  const stress = useRef<SVGSVGElement>(null);
  const endMin = niceCycleEnd(Math.max(...runs.map((r) => r.result.history.timeS[r.result.history.timeS.length - 1] / 60)));
  const chartRuns = runs.map((r) => ({ label: r.label, history: r.result.history }));
  const common = { runs: chartRuns, endMin, width };
  return (
    <div className="flex flex-col gap-4" data-testid="run-charts">
      <Framed title="Temperatures" fileBase={fileBase} target={temperature}>
        <RunHistoryChart ref={temperature} title="Temperatures" unit="°C" series={TEMPERATURE_SERIES} testId="chart-temperatures" {...common} />
      </Framed>
      <Framed title="Degree of cure" fileBase={fileBase} target={cure}>
        <RunHistoryChart ref={cure} title="Degree of cure" unit="α" domain={[0, 1]} format={(v) => v.toFixed(1)} series={CURE_SERIES} testId="chart-cure" {...common} />
      </Framed>
      <Framed title="Glass transition" fileBase={fileBase} target={tg}>
        <RunHistoryChart ref={tg} title="Glass transition" unit="°C" series={TG_SERIES} testId="chart-tg" {...common} />
      </Framed>
      <Framed title="Resin modulus" fileBase={fileBase} target={modulus}>
        <RunHistoryChart ref={modulus} title="Resin modulus" unit="GPa" series={MODULUS_SERIES} testId="chart-modulus" {...common} />
      </Framed>
      <Framed title="Final ply stresses" fileBase={fileBase} target={stress}>
        <PlyStressProfileChart ref={stress} runs={runs.map((r) => ({ label: r.label, plyStresses: r.result.plyStresses }))} width={width} testId="chart-ply-stress" />
      </Framed>
    </div>
  );
}

import { memo, useMemo } from 'react';
import { kToC, paToGpa } from '../../../shared/units';
import { HistoryChart, type HistoryEvent, type HistoryGuide, type HistorySeries, type ResultRun } from './history-chart';
import type { TimeAxis } from './time-axis';

/**
 * The result charts over time, defined once: the workspace draws them for its one run under the cycle editor
 * (with the scrubber), the compare view and the report draw them for one or two runs.
 */

const same = (v: number) => v;

/** The four temperatures the workspace's cycle editor draws under its set point, in the same colours. */
export const TEMPERATURE_SERIES: HistorySeries[] = [
  { label: 'air', colour: 'var(--color-ember)', pick: (h) => h.airK, toDisplay: kToC, strokeWidth: 1.2 },
  { label: 'tool', colour: 'var(--color-slate)', pick: (h) => h.toolK, toDisplay: kToC, strokeWidth: 1.2 },
  { label: 'part surface', colour: 'var(--color-saffron)', pick: (h) => h.bagSurfaceK, toDisplay: kToC, strokeWidth: 1.3 },
  { label: 'mid-plane', colour: 'var(--color-fault)', pick: (h) => h.midPlaneK, toDisplay: kToC, strokeWidth: 2 },
];
export const CURE_SERIES: HistorySeries[] = [
  {
    label: 'through-thickness spread',
    colour: 'var(--color-verdigris)',
    pick: (h) => h.alphaMin,
    pickUpper: (h) => h.alphaMax,
    toDisplay: same,
    singleRunOnly: true,
  },
  { label: 'least cured point', colour: 'var(--color-verdigris)', pick: (h) => h.alphaMin, toDisplay: same, strokeWidth: 1.8 },
  { label: 'most cured point', colour: 'var(--color-verdigris)', pick: (h) => h.alphaMax, toDisplay: same, strokeWidth: 0.8, singleRunOnly: true, unlisted: true },
];
export const TG_SERIES: HistorySeries[] = [
  { label: 'Tg at mid-plane', colour: 'var(--color-slate)', pick: (h) => h.tgMidK, toDisplay: kToC, strokeWidth: 1.8 },
  { label: 'mid-plane temperature', colour: 'var(--color-fault)', pick: (h) => h.midPlaneK, toDisplay: kToC, strokeWidth: 1.2 },
];
export const MODULUS_SERIES: HistorySeries[] = [
  { label: 'mid-plane resin', colour: 'var(--color-ink)', pick: (h) => h.resinModulusMidPa, toDisplay: paToGpa, strokeWidth: 1.5 },
];

/** What every result chart over time takes: the runs, the time axis, and optionally the scrubber. */
export interface ResultChartProps {
  runs: ResultRun[];
  axis: TimeAxis;
  height?: number;
  showTimeLabels?: boolean;
  scrubMin?: number;
  onScrub?: (minutes: number) => void;
  fileBase?: string;
  className?: string;
}

export const TemperatureChart = memo(function TemperatureChart(props: ResultChartProps) {
  return <HistoryChart title="Temperatures" unit="°C" series={TEMPERATURE_SERIES} testId="chart-temperatures" {...props} />;
});

const cureDomain = (): [number, number] => [0, 1];
const oneDecimal = (v: number) => v.toFixed(1);

/** Degree of cure, with the gel point as a guide and each run's gelation and vitrification marked. */
export const CureChart = memo(function CureChart(props: ResultChartProps) {
  const { runs } = props;
  const guides = useMemo<HistoryGuide[]>(
    () =>
      [...new Set(runs.flatMap((r) => (r.gelPoint === undefined ? [] : [r.gelPoint])))].map((value) => ({
        value,
        label: 'gel point',
        colour: 'var(--color-ink-faint)',
        dash: '2 3',
      })),
    [runs],
  );
  const events = useMemo<HistoryEvent[]>(
    () =>
      runs.flatMap((r, run) => [
        { run, minutes: r.result.summary.gelTimeMin, label: 'gel', colour: 'var(--color-verdigris)' },
        { run, minutes: r.result.summary.vitrificationTimeMin, label: 'vitrified', colour: 'var(--color-slate)' },
      ]),
    [runs],
  );
  return (
    <HistoryChart
      title="Degree of cure"
      unit="α"
      series={CURE_SERIES}
      domain={cureDomain}
      format={oneDecimal}
      guides={guides}
      events={events}
      testId="chart-cure"
      {...props}
    />
  );
});

// From 0 °C (or below) to 10 °C over the higher of Tg and the part, so the crossing sits inside the plot.
const tgDomain = ([lo, hi]: [number, number]): [number, number] => [Math.min(0, lo), hi + 10];

/** Tg against the part's temperature: where the part runs hotter than its Tg it is rubbery. */
export const GlassChart = memo(function GlassChart(props: ResultChartProps) {
  return <HistoryChart title="Tg against part" unit="°C" series={TG_SERIES} domain={tgDomain} testId="chart-tg" {...props} />;
});

const modulusDomain = ([, hi]: [number, number]): [number, number] => [0, Math.max(0.1, hi)];

export const ModulusChart = memo(function ModulusChart(props: ResultChartProps) {
  return <HistoryChart title="Resin modulus" unit="GPa" series={MODULUS_SERIES} domain={modulusDomain} testId="chart-modulus" {...props} />;
});

import { memo } from 'react';
import { bandPath, seriesPath } from '../../../../components/charts/series-path';
import { useTimeAxis } from '../../../../components/charts/time-axis';
import type { SimulationResult } from '../../model/simulation-result';
import { useResults } from '../../stores/results-store';
import { useStudyEditor } from '../../stores/study-editor-store';
import { Lane } from './lane';

const K0 = 273.15;

function extent(arrays: ArrayLike<number>[], offset = 0): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (const a of arrays)
    for (let i = 0; i < a.length; i++) {
      if (a[i] < lo) lo = a[i];
      if (a[i] > hi) hi = a[i];
    }
  return Number.isFinite(lo) ? [lo + offset, hi + offset] : [0, 1];
}

/** Vertical marker at a time (minutes) with a short label at the top; nothing when the event never happened. */
function EventMark({ minutes, label, colour, height }: { minutes: number; label: string; colour: string; height: number }) {
  const { x } = useTimeAxis();
  if (!(minutes >= 0)) return null;
  const px = x(minutes);
  return (
    <g pointerEvents="none">
      <line x1={px} x2={px} y1={0} y2={height} stroke={colour} strokeDasharray="3 3" />
      <text x={px + 3} y={9} fontSize={10} fill={colour}>
        {label} <tspan className="num">{minutes.toFixed(0)} min</tspan>
      </text>
    </g>
  );
}

const CureLane = memo(function CureLane({ result, gelPoint }: { result: SimulationResult; gelPoint: number }) {
  const { x, plotWidth } = useTimeAxis();
  const h = result.history;
  const toX = (s: number) => x(s / 60);
  return (
    <Lane
      title="Degree of cure"
      unit="α"
      domain={[0, 1]}
      format={(v) => v.toFixed(1)}
      testId="lane-cure"
      legend={[
        { label: 'through-thickness spread', colour: 'var(--color-verdigris)', band: true },
        { label: 'least cured point', colour: 'var(--color-verdigris)' },
        { label: 'gel point', colour: 'var(--color-ink-faint)', dash: '2 3' },
      ]}
    >
      {(y, height) => (
        <>
          <path d={bandPath(h.timeS, h.alphaMin, h.alphaMax, toX, y, plotWidth)} fill="var(--color-verdigris)" opacity={0.22} />
          <path d={seriesPath(h.timeS, h.alphaMin, toX, y, plotWidth)} fill="none" stroke="var(--color-verdigris)" strokeWidth={1.8} />
          <path d={seriesPath(h.timeS, h.alphaMax, toX, y, plotWidth)} fill="none" stroke="var(--color-verdigris)" strokeWidth={0.8} />
          <line x1={0} x2={plotWidth} y1={y(gelPoint)} y2={y(gelPoint)} stroke="var(--color-ink-faint)" strokeDasharray="2 3" />
          <EventMark minutes={result.summary.gelTimeMin} label="gel" colour="var(--color-verdigris)" height={height} />
          <EventMark minutes={result.summary.vitrificationTimeMin} label="vitrified" colour="var(--color-slate)" height={height} />
        </>
      )}
    </Lane>
  );
});

const GlassLane = memo(function GlassLane({ result }: { result: SimulationResult }) {
  const { x, plotWidth } = useTimeAxis();
  const h = result.history;
  const toX = (s: number) => x(s / 60);
  const [lo, hi] = extent([h.tgMidK, h.midPlaneK], -K0);
  return (
    <Lane
      title="Tg against part"
      unit="°C"
      domain={[Math.min(0, lo), hi + 10]}
      testId="lane-tg"
      legend={[
        { label: 'Tg at mid-plane', colour: 'var(--color-slate)' },
        { label: 'mid-plane temperature', colour: 'var(--color-fault)' },
      ]}
    >
      {(y) => (
        <>
          <path d={seriesPath(h.timeS, h.tgMidK, toX, (k) => y(k - K0), plotWidth)} fill="none" stroke="var(--color-slate)" strokeWidth={1.8} />
          <path d={seriesPath(h.timeS, h.midPlaneK, toX, (k) => y(k - K0), plotWidth)} fill="none" stroke="var(--color-fault)" strokeWidth={1.2} />
        </>
      )}
    </Lane>
  );
});

const ModulusLane = memo(function ModulusLane({ result }: { result: SimulationResult }) {
  const { x, plotWidth } = useTimeAxis();
  const h = result.history;
  const toX = (s: number) => x(s / 60);
  const [, hi] = extent([h.resinModulusMidPa]);
  return (
    <Lane
      title="Resin modulus"
      unit="GPa"
      domain={[0, Math.max(0.1, hi / 1e9)]}
      showTimeLabels
      testId="lane-modulus"
      legend={[{ label: 'mid-plane resin', colour: 'var(--color-ink)' }]}
    >
      {(y) => (
        <path
          d={seriesPath(h.timeS, h.resinModulusMidPa, toX, (pa) => y(pa / 1e9), plotWidth)}
          fill="none"
          stroke="var(--color-ink)"
          strokeWidth={1.5}
        />
      )}
    </Lane>
  );
});

/** The result lanes under the cycle editor, all on its time axis. */
export function HistoryLanes() {
  const result = useResults((s) => s.result);
  const gelPoint = useStudyEditor((s) => s.params?.resin.gelPoint ?? 0.5);
  if (!result) return <p className="border-t border-rule p-4 text-sm text-ink-faint">Waiting for the first solve…</p>;
  return (
    <>
      <CureLane result={result} gelPoint={gelPoint} />
      <GlassLane result={result} />
      <ModulusLane result={result} />
    </>
  );
}

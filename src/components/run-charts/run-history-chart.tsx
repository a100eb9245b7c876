import { forwardRef, useMemo } from 'react';
import { scaleLinear } from 'd3-scale';
import type { SimulationResult } from '../../../shared/solver/simulation-result';
import { seriesPath } from '../charts/series-path';
import { makeTimeAxis, TimeAxisProvider, TimeTicks, ValueTicks } from '../charts/time-axis';
import { markerIndices, markerPath, RUN_STYLES } from './run-styles';

/** One quantity drawn for every run: a history array and its conversion to the unit on the axis. */
export interface HistorySeries {
  label: string;
  colour: string;
  pick: (h: SimulationResult['history']) => ArrayLike<number>;
  toDisplay: (si: number) => number;
  strokeWidth?: number;
}

export interface ChartRun {
  /** "Two-dwell cycle · r2" */
  label: string;
  history: SimulationResult['history'];
}

const HEIGHT = 190;
const TOP = 14;
const BOTTOM = 32;
/** markers about every 70 px: enough to tell the runs apart, few enough not to hide the line */
const MARKER_SPACING_PX = 70;

function displayExtent(runs: ChartRun[], series: HistorySeries[]): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (const run of runs)
    for (const s of series) {
      const a = s.pick(run.history);
      for (let i = 0; i < a.length; i++) {
        const v = s.toDisplay(a[i]);
        if (v < lo) lo = v;
        if (v > hi) hi = v;
      }
    }
  if (!Number.isFinite(lo)) return [0, 1];
  if (hi - lo < 1e-9) return [lo - 1, hi + 1];
  return [lo, hi];
}

/**
 * Time histories of one or more runs on one time axis (minutes, from 0 to `endMin`). Each run keeps its dash
 * pattern and marker shape across every chart (RUN_STYLES), so the comparison reads in greyscale and in print.
 */
export const RunHistoryChart = forwardRef<SVGSVGElement, {
  title: string;
  unit: string;
  runs: ChartRun[];
  series: HistorySeries[];
  endMin: number;
  width: number;
  /** fixed value range; default: the data's extent */
  domain?: [number, number];
  format?: (v: number) => string;
  testId?: string;
}>(function RunHistoryChart({ title, unit, runs, series, endMin, width, domain, format, testId }, ref) {
  const axis = useMemo(() => makeTimeAxis([0, endMin], width), [endMin, width]);
  const plotHeight = HEIGHT - TOP - BOTTOM;
  const y = useMemo(
    () => scaleLinear().domain(domain ?? displayExtent(runs, series)).range([plotHeight, 0]).nice(4),
    [domain, runs, series, plotHeight],
  );
  const minutesPerMarker = (MARKER_SPACING_PX / axis.plotWidth) * endMin;

  return (
    <figure className="break-inside-avoid" data-testid={testId}>
      <figcaption className="flex flex-wrap items-center gap-x-3 gap-y-0.5 px-1 pb-1 text-xs text-ink-soft">
        <span className="text-[11px] font-semibold uppercase tracking-[0.08em]">{title}</span>
        {series.map((s) => (
          <span key={s.label} className="flex items-center gap-1">
            <svg width="14" height="8" aria-hidden>
              <rect y="2" width="14" height="4" fill={s.colour} />
            </svg>
            {s.label}
          </span>
        ))}
        {runs.length > 1 &&
          runs.map((run, r) => (
            <span key={r} className="flex items-center gap-1" data-testid="run-legend">
              <RunKey index={r} />
              <span>
                <span className="font-semibold">{RUN_STYLES[r].letter}</span> {run.label}
              </span>
            </span>
          ))}
      </figcaption>
      <svg
        ref={ref}
        width={width}
        height={HEIGHT}
        role="img"
        aria-label={`${title} against time${runs.length > 1 ? `, runs ${runs.map((r, i) => `${RUN_STYLES[i].letter}: ${r.label}`).join('; ')}` : ''}`}
        className="block text-ink-faint"
        fontFamily="IBM Plex Sans, sans-serif"
      >
        <TimeAxisProvider axis={axis}>
          <g transform={`translate(${axis.marginLeft},${TOP})`}>
            <ValueTicks y={y} width={axis.plotWidth} unit={unit} count={4} format={format} />
            <TimeTicks height={plotHeight} />
            {runs.map((run, r) => {
              const style = RUN_STYLES[r];
              const toX = (s: number) => axis.x(s / 60);
              return (
                <g key={r} data-run={style.letter}>
                  {series.map((s) => {
                    const values = s.pick(run.history);
                    const toY = (v: number) => y(s.toDisplay(v));
                    const marks = runs.length > 1 ? markerIndices(run.history.timeS, minutesPerMarker * 60, style.markerPhase) : [];
                    return (
                      <g key={s.label}>
                        <path
                          d={seriesPath(run.history.timeS, values, toX, toY, axis.plotWidth)}
                          fill="none"
                          stroke={s.colour}
                          strokeWidth={s.strokeWidth ?? 1.6}
                          strokeDasharray={style.dash}
                        />
                        {marks.map((i) => (
                          <path
                            key={i}
                            d={markerPath(style.marker)}
                            transform={`translate(${toX(run.history.timeS[i])},${toY(values[i])})`}
                            fill="var(--color-paper-raised)"
                            stroke={s.colour}
                            strokeWidth={1.3}
                          />
                        ))}
                      </g>
                    );
                  })}
                </g>
              );
            })}
          </g>
        </TimeAxisProvider>
      </svg>
    </figure>
  );
});

/** The dash-and-marker key of run `index`, as drawn on the charts. */
export function RunKey({ index }: { index: number }) {
  const style = RUN_STYLES[index];
  return (
    <svg width="26" height="10" aria-hidden className="text-ink">
      <line x1="0" x2="26" y1="5" y2="5" stroke="currentColor" strokeWidth="1.6" strokeDasharray={style.dash} />
      <path d={markerPath(style.marker)} transform="translate(13,5)" fill="var(--color-paper-raised)" stroke="currentColor" strokeWidth="1.3" />
    </svg>
  );
}

import { memo, useMemo, type PointerEvent as ReactPointerEvent } from 'react';
import { scaleLinear, type ScaleLinear } from 'd3-scale';
import type { SimulationResult } from '../../../shared/solver/simulation-result';
import { ChartFigure, runsDescription, type LegendEntry } from './chart-figure';
import { markerIndices, markerPath, RUN_STYLES } from './run-styles';
import { labelRows, textWidthPx } from './label-rows';
import { ScrubLine } from './scrub-line';
import { PiecedPath } from './pieced-path';
import { bandPieces, seriesPath, seriesPieces } from './series-path';
import { TimeAxisProvider, TimeTicks, ValueTicks, type TimeAxis } from './time-axis';

export type History = SimulationResult['history'];

/** One solved run to draw: "Two-dwell cycle · r2" and its result. */
export interface ResultRun {
  label: string;
  result: SimulationResult;
  /** the resin's degree of cure at gelation, drawn as a guide on the cure chart when known */
  gelPoint?: number;
}

/** One quantity drawn for every run: a history array and its conversion to the unit on the axis. */
export interface HistorySeries {
  label: string;
  colour: string;
  pick: (h: History) => ArrayLike<number>;
  /** with an upper edge the series is a filled band from `pick` up to it, not a line */
  pickUpper?: (h: History) => ArrayLike<number>;
  toDisplay: (si: number) => number;
  strokeWidth?: number;
  /** a detail drawn for a single run only: overlaid runs keep to the lines that compare */
  singleRunOnly?: boolean;
  /** left out of the key (a thin companion of a line already named) */
  unlisted?: boolean;
}

/** A horizontal guide at a value in the axis's unit (the gel point on the cure chart). */
export interface HistoryGuide {
  value: number;
  label: string;
  colour: string;
  dash: string;
}

/** A vertical mark at a moment of one run (gelation, vitrification); left out when the run never got there. */
export interface HistoryEvent {
  run: number;
  minutes: number;
  label: string;
  colour: string;
}

const TOP = 12;
/** markers about every 70 px: enough to tell the runs apart, few enough not to hide the line */
const MARKER_SPACING_PX = 70;

function dataExtent(runs: ResultRun[], series: HistorySeries[]): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (const run of runs)
    for (const s of series)
      for (const pick of s.pickUpper ? [s.pick, s.pickUpper] : [s.pick]) {
        const a = pick(run.result.history);
        for (let i = 0; i < a.length; i++) {
          const v = s.toDisplay(a[i]);
          if (v < lo) lo = v;
          if (v > hi) hi = v;
        }
      }
  return Number.isFinite(lo) ? [lo, hi] : [0, 1];
}

/**
 * The series paths of every run; memoised apart from the scrub line so moving the scrubber redraws no path.
 * Solid lines and bands are drawn in pieces (PiecedPath): while a handle is dragged, only the part of each
 * curve from the edited moment on is rewritten and repainted. A dashed line stays one path, its dashes even.
 */
const SeriesLayer = memo(function SeriesLayer({
  runs,
  series,
  axis,
  y,
}: {
  runs: ResultRun[];
  series: HistorySeries[];
  axis: TimeAxis;
  y: ScaleLinear<number, number>;
}) {
  const overlaid = runs.length > 1;
  const toX = (s: number) => axis.x(s / 60);
  const [d0, d1] = axis.x.domain();
  const secondsPerMarker = (MARKER_SPACING_PX / axis.plotWidth) * (d1 - d0) * 60;
  return (
    <>
      {runs.map((run, r) => {
        const style = RUN_STYLES[r];
        const h = run.result.history;
        return (
          <g key={r} data-run={style.letter}>
            {series.map((s) => {
              if (overlaid && s.singleRunOnly) return null;
              const values = s.pick(h);
              const toY = (v: number) => y(s.toDisplay(v));
              if (s.pickUpper) {
                // A fill has no dashes to keep even: always in pieces. fill-opacity, not opacity: each piece
                // blends on its own, so neighbours meet without a seam.
                return (
                  <PiecedPath key={s.label} data-series={s.label} pieces={bandPieces(h.timeS, values, s.pickUpper(h), toX, toY)} fill={s.colour} fillOpacity={0.22} />
                );
              }
              const marks = overlaid ? markerIndices(h.timeS, secondsPerMarker, style.markerPhase) : [];
              const paint = { fill: 'none', stroke: s.colour, strokeWidth: s.strokeWidth ?? 1.6 };
              return (
                <g key={s.label} data-series={s.label}>
                  {style.dash === undefined ? (
                    <PiecedPath pieces={seriesPieces(h.timeS, values, toX, toY)} {...paint} />
                  ) : (
                    <path d={seriesPath(h.timeS, values, toX, toY, axis.plotWidth)} {...paint} strokeDasharray={style.dash} />
                  )}
                  {marks.map((i) => (
                    <path
                      key={i}
                      d={markerPath(style.marker)}
                      transform={`translate(${toX(h.timeS[i])},${toY(values[i])})`}
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
    </>
  );
});

const EVENT_FONT_PX = 10;
const eventText = (event: HistoryEvent, prefix: string) => `${prefix}${event.label} ${event.minutes.toFixed(0)} min`;

function EventMark({ event, x, height, prefix, row }: { event: HistoryEvent; x: ScaleLinear<number, number>; height: number; prefix: string; row: number }) {
  if (!(event.minutes >= 0)) return null;
  const px = x(event.minutes);
  return (
    <g pointerEvents="none">
      <line x1={px} x2={px} y1={0} y2={height} stroke={event.colour} strokeDasharray="3 3" />
      <text x={px + 3} y={9 + row * 11} fontSize={EVENT_FONT_PX} fill={event.colour}>
        {eventText(event, prefix)}
      </text>
    </g>
  );
}

/**
 * Time histories of one or more runs on a time axis (minutes). A single run is drawn in full; overlaid runs
 * each keep their dash pattern and marker shape (RUN_STYLES), so a comparison reads in greyscale and in print.
 * With `onScrub`, pressing or dragging on the plot reports the time under the pointer; `scrubMin` draws it.
 */
export function HistoryChart({
  title,
  unit,
  runs,
  series,
  axis,
  height = 190,
  showTimeLabels = true,
  domain,
  format,
  guides = [],
  events = [],
  scrubMin,
  onScrub,
  fileBase,
  testId,
  className,
}: {
  title: string;
  unit: string;
  runs: ResultRun[];
  series: HistorySeries[];
  axis: TimeAxis;
  height?: number;
  showTimeLabels?: boolean;
  /** the value range from the data's extent (display units); default the extent itself */
  domain?: (extent: [number, number]) => [number, number];
  format?: (v: number) => string;
  guides?: HistoryGuide[];
  events?: HistoryEvent[];
  scrubMin?: number;
  onScrub?: (minutes: number) => void;
  fileBase?: string;
  testId?: string;
  className?: string;
}) {
  const plotHeight = height - TOP - (showTimeLabels ? 30 : 8);
  const extent = useMemo(() => dataExtent(runs, series), [runs, series]);
  let [lo, hi] = domain ? domain(extent) : extent;
  if (hi - lo < 1e-9) [lo, hi] = [lo - 1, hi + 1];
  const y = useMemo(() => scaleLinear().domain([lo, hi]).range([plotHeight, 0]).nice(4), [lo, hi, plotHeight]);
  const runLabels = runs.map((r) => r.label);
  const overlaid = runs.length > 1;
  const legend: LegendEntry[] = [
    ...series
      .filter((s) => !s.unlisted && !(overlaid && s.singleRunOnly))
      .map((s) => ({ label: s.label, colour: s.colour, band: !!s.pickUpper })),
    ...guides.map((g) => ({ label: g.label, colour: g.colour, dash: g.dash })),
  ].filter((entry, i, all) => all.findIndex((e) => e.label === entry.label) === i);

  // Event labels that would run into each other (gel and vitrification of two runs close in time) stagger.
  const eventPrefix = (ev: HistoryEvent) => (overlaid ? `${RUN_STYLES[ev.run].letter} ` : '');
  const eventRows = labelRows(
    events.map((ev) => ({ x: ev.minutes >= 0 ? axis.x(ev.minutes) : -Infinity, width: textWidthPx(eventText(ev, eventPrefix(ev)), EVENT_FONT_PX) + 3 })),
  );

  function scrub(e: ReactPointerEvent<SVGRectElement>) {
    const rect = e.currentTarget.getBoundingClientRect();
    onScrub?.(axis.x.invert(e.clientX - rect.left));
  }

  return (
    <ChartFigure
      title={title}
      legend={legend}
      runLabels={runLabels}
      width={axis.width}
      height={height}
      ariaLabel={`${title} against time${runsDescription(runLabels)}`}
      fileBase={fileBase}
      testId={testId}
      className={className}
      svgClassName={onScrub ? 'touch-none select-none' : ''}
    >
      <TimeAxisProvider axis={axis}>
        <g transform={`translate(${axis.marginLeft},${TOP})`}>
          <ValueTicks y={y} width={axis.plotWidth} unit={unit} count={plotHeight < 120 ? 3 : 4} format={format} />
          <TimeTicks height={plotHeight} showLabels={showTimeLabels} />
          <SeriesLayer runs={runs} series={series} axis={axis} y={y} />
          {guides.map((g) => (
            <line key={g.value} x1={0} x2={axis.plotWidth} y1={y(g.value)} y2={y(g.value)} stroke={g.colour} strokeDasharray={g.dash} pointerEvents="none" />
          ))}
          {events.map((ev, i) => (
            <EventMark key={i} event={ev} x={axis.x} height={plotHeight} prefix={eventPrefix(ev)} row={eventRows[i]} />
          ))}
          {scrubMin !== undefined && <ScrubLine x={axis.x} minutes={scrubMin} height={plotHeight} />}
          {onScrub && (
            <rect
              width={axis.plotWidth}
              height={plotHeight}
              fill="transparent"
              style={{ cursor: 'col-resize' }}
              onPointerDown={(e) => {
                e.currentTarget.setPointerCapture?.(e.pointerId);
                scrub(e);
              }}
              onPointerMove={(e) => {
                if (e.buttons & 1) scrub(e);
              }}
            />
          )}
        </g>
      </TimeAxisProvider>
    </ChartFigure>
  );
}

import { createContext, useContext, type ReactNode } from 'react';
import { scaleLinear, type ScaleLinear } from 'd3-scale';

/**
 * One time axis shared by every lane of the workspace: the same minutes land
 * on the same pixel column in the cycle editor and in each result chart.
 */
export type TimeAxis = {
  /** minutes → px inside the plot area (0 at the left margin) */
  x: ScaleLinear<number, number>;
  width: number;
  marginLeft: number;
  marginRight: number;
  plotWidth: number;
};

export const CHART_MARGIN = { left: 52, right: 14 };

export function makeTimeAxis(domainMin: [number, number], width: number): TimeAxis {
  const plotWidth = Math.max(40, width - CHART_MARGIN.left - CHART_MARGIN.right);
  return {
    x: scaleLinear().domain(domainMin).range([0, plotWidth]),
    width,
    marginLeft: CHART_MARGIN.left,
    marginRight: CHART_MARGIN.right,
    plotWidth,
  };
}

const TimeAxisContext = createContext<TimeAxis | null>(null);

export function TimeAxisProvider({ axis, children }: { axis: TimeAxis; children: ReactNode }) {
  return <TimeAxisContext.Provider value={axis}>{children}</TimeAxisContext.Provider>;
}

export function useTimeAxis(): TimeAxis {
  const axis = useContext(TimeAxisContext);
  if (!axis) throw new Error('useTimeAxis needs a TimeAxisProvider above it');
  return axis;
}

/** A round end for the time axis: the next multiple of 30 min (of 60 beyond 8 h). */
export function niceCycleEnd(minutes: number): number {
  const step = minutes > 480 ? 60 : 30;
  return Math.max(step, Math.ceil((minutes * 1.03) / step) * step);
}

/** Ticks along the bottom of a plot area, in minutes with the unit on the last label. */
export function TimeTicks({ height, showLabels = true }: { height: number; showLabels?: boolean }) {
  const { x } = useTimeAxis();
  const ticks = x.ticks(8);
  return (
    <g aria-hidden className="text-ink-faint">
      {ticks.map((t) => (
        <g key={t} transform={`translate(${x(t)},0)`}>
          <line y1={0} y2={height} stroke="var(--color-rule)" strokeWidth={0.6} />
          {showLabels && (
            <text y={height + 12} textAnchor="middle" className="num" fontSize={10} fill="currentColor">
              {t}
            </text>
          )}
        </g>
      ))}
      {showLabels && (
        <text x={x.range()[1]} y={height + 24} textAnchor="end" fontSize={10} fill="currentColor">
          time, min
        </text>
      )}
    </g>
  );
}

/** Horizontal grid and labels for a value scale; the unit reads upward beside the labels. */
export function ValueTicks({
  y,
  width,
  unit,
  count = 4,
  format = (v: number) => String(v),
}: {
  y: ScaleLinear<number, number>;
  width: number;
  unit: string;
  count?: number;
  format?: (v: number) => string;
}) {
  const ticks = y.ticks(count);
  // Clear of the widest tick label (right-aligned 6 px left of the axis), at about 6 px per character.
  const widest = Math.max(0, ...ticks.map((v) => format(v).length));
  const labelGap = 6 + widest * 6 + 8;
  return (
    <g aria-hidden className="text-ink-faint">
      {ticks.map((v) => (
        <g key={v} transform={`translate(0,${y(v)})`}>
          <line x1={0} x2={width} stroke="var(--color-rule)" strokeWidth={0.6} />
          <text x={-6} dy="0.32em" textAnchor="end" className="num" fontSize={10} fill="currentColor">
            {format(v)}
          </text>
        </g>
      ))}
      {/* The unit stands upright beside the tick labels, halfway up the axis: above them it sat on the top label. */}
      <text
        transform={`translate(${-labelGap},${(y.range()[0] + y.range()[1]) / 2}) rotate(-90)`}
        textAnchor="middle"
        fontSize={10}
        fill="currentColor"
        data-axis-unit
      >
        {unit}
      </text>
    </g>
  );
}

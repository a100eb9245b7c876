import { useMemo, useRef, type ReactNode, type PointerEvent as ReactPointerEvent } from 'react';
import { scaleLinear, type ScaleLinear } from 'd3-scale';
import { TimeTicks, ValueTicks, useTimeAxis } from '../../../../components/charts/time-axis';
import { ChartExportControl } from '../../../../components/export/chart-export-control';
import { fileSlug } from '../../../../lib/chart-export';
import { ScrubLine } from '../cycle/cycle-editor';
import { resultsStore } from '../../stores/results-store';

const TOP = 12;

export type LegendItem = { label: string; colour: string; dash?: string; band?: boolean };

/**
 * One result lane on the shared time axis. Pressing or dragging on the plot
 * moves the scrubber (the time the through-thickness views show).
 */
export function Lane({
  title,
  unit,
  domain,
  height = 118,
  showTimeLabels = false,
  legend,
  format,
  testId,
  children,
}: {
  title: string;
  unit: string;
  domain: [number, number];
  height?: number;
  showTimeLabels?: boolean;
  legend: LegendItem[];
  format?: (v: number) => string;
  testId?: string;
  children: (y: ScaleLinear<number, number>, plotHeight: number) => ReactNode;
}) {
  const axis = useTimeAxis();
  const svgRef = useRef<SVGSVGElement>(null);
  const plotHeight = height - TOP - (showTimeLabels ? 30 : 8);
  const y = useMemo(() => scaleLinear().domain(domain).range([plotHeight, 0]).nice(4), [domain, plotHeight]);

  function scrub(e: ReactPointerEvent<SVGRectElement>) {
    const rect = e.currentTarget.getBoundingClientRect();
    resultsStore.getState().scrubTo(axis.x.invert(e.clientX - rect.left));
  }

  return (
    <figure className="border-t border-rule" data-testid={testId}>
      <figcaption className="flex flex-wrap items-center gap-x-3 px-2 pt-1 text-xs">
        <span className="text-[11px] font-semibold uppercase tracking-[0.08em] text-ink-soft">{title}</span>
        {legend.map((l) => (
          <span key={l.label} className="flex items-center gap-1 text-ink-soft">
            <svg width="16" height="8" aria-hidden>
              {l.band ? (
                <rect width="16" height="8" fill={l.colour} opacity={0.35} />
              ) : (
                <line x1="0" x2="16" y1="4" y2="4" stroke={l.colour} strokeWidth="2" strokeDasharray={l.dash} />
              )}
            </svg>
            {l.label}
          </span>
        ))}
        <span className="ml-auto">
          <ChartExportControl target={svgRef} fileBase={`dwellform-${fileSlug(title)}`} title={title} />
        </span>
      </figcaption>
      <svg ref={svgRef} width={axis.width} height={height} className="block touch-none select-none" aria-label={`${title} against time`} role="img">
        <g transform={`translate(${axis.marginLeft},${TOP})`}>
          <ValueTicks y={y} width={axis.plotWidth} unit={unit} count={3} format={format} />
          <TimeTicks height={plotHeight} showLabels={showTimeLabels} />
          {children(y, plotHeight)}
          <ScrubLine x={axis.x} height={plotHeight} />
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
        </g>
      </svg>
    </figure>
  );
}

import { useRef, type ReactNode } from 'react';
import { fileSlug } from '../../lib/chart-export';
import { ChartExportControl } from '../export/chart-export-control';
import { markerPath, RUN_STYLES } from './run-styles';

/** One entry of a chart's key: a line (optionally dashed) or a filled band, in the quantity's colour. */
export type LegendEntry = { label: string; colour: string; dash?: string; band?: boolean };

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

function LegendSwatch({ entry, overlaid }: { entry: LegendEntry; overlaid: boolean }) {
  if (entry.band) {
    return (
      <svg width="16" height="8" aria-hidden>
        <rect width="16" height="8" fill={entry.colour} opacity={0.35} />
      </svg>
    );
  }
  // With runs overlaid a dash means a run, so a quantity's key is its colour alone.
  if (overlaid && !entry.dash) {
    return (
      <svg width="16" height="8" aria-hidden>
        <rect y="2" width="16" height="4" fill={entry.colour} />
      </svg>
    );
  }
  return (
    <svg width="16" height="8" aria-hidden>
      <line x1="0" x2="16" y1="4" y2="4" stroke={entry.colour} strokeWidth="2" strokeDasharray={entry.dash} />
    </svg>
  );
}

/**
 * The frame every result chart shares: a caption with the title, the key of quantities, the key of runs
 * (when more than one is drawn) and the SVG/PNG export of the chart, then the chart's own <svg>.
 */
export function ChartFigure({
  title,
  legend,
  runLabels,
  width,
  height,
  ariaLabel,
  fileBase = 'dwellform',
  testId,
  className = '',
  svgClassName = '',
  children,
}: {
  title: string;
  legend: LegendEntry[];
  /** labels of the runs drawn, in RUN_STYLES order */
  runLabels: string[];
  width: number;
  height: number;
  ariaLabel: string;
  /** start of exported file names; the chart's title follows it */
  fileBase?: string;
  testId?: string;
  className?: string;
  svgClassName?: string;
  children: ReactNode;
}) {
  const svgRef = useRef<SVGSVGElement>(null);
  const overlaid = runLabels.length > 1;
  return (
    <figure className={`paint-island break-inside-avoid ${className}`} data-testid={testId}>
      <figcaption className="flex flex-wrap items-center gap-x-3 gap-y-0.5 px-2 pt-1 pb-0.5 text-xs text-ink-soft">
        <span className="text-[11px] font-semibold uppercase tracking-[0.08em]">{title}</span>
        {legend.map((entry) => (
          <span key={entry.label} className="flex items-center gap-1">
            <LegendSwatch entry={entry} overlaid={overlaid} />
            {entry.label}
          </span>
        ))}
        {overlaid &&
          runLabels.map((label, r) => (
            <span key={r} className="flex items-center gap-1" data-testid="run-legend">
              <RunKey index={r} />
              <span>
                <span className="font-semibold">{RUN_STYLES[r].letter}</span> {label}
              </span>
            </span>
          ))}
        <span className="ml-auto">
          <ChartExportControl target={svgRef} fileBase={`${fileBase}-${fileSlug(title)}`} title={title} />
        </span>
      </figcaption>
      <svg
        ref={svgRef}
        width={width}
        height={height}
        role="img"
        aria-label={ariaLabel}
        className={`block text-ink-faint ${svgClassName}`}
        fontFamily="IBM Plex Sans, sans-serif"
      >
        {children}
      </svg>
    </figure>
  );
}

/** "…, runs A: x; B: y" for an overlaid chart's accessible name; nothing for a single run. */
export function runsDescription(runLabels: string[]): string {
  return runLabels.length > 1 ? `, runs ${runLabels.map((l, i) => `${RUN_STYLES[i].letter}: ${l}`).join('; ')}` : '';
}

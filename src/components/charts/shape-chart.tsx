import { memo } from 'react';
import { ChartFigure, runsDescription } from './chart-figure';
import { RUN_STYLES } from './run-styles';

/** What the shape drawing needs of one run: its curvature and spring-in, and the part's designed geometry. */
export interface ShapeRun {
  label: string;
  /** strip curvature after demould, 1/m */
  kxPerM: number;
  springInDeg: number;
  stripSpanMm: number;
  cornerAngleDeg: number;
}

/** Past a closed (or flattened) corner the drawing would mean nothing: it stops at 5° and 179°. */
export function drawnCornerDeg(cornerAngleDeg: number, springInDeg: number, factor: number): { deg: number; clipped: boolean } {
  const raw = cornerAngleDeg - springInDeg * factor;
  const deg = Math.min(179, Math.max(5, raw));
  return { deg, clipped: deg !== raw };
}

const H = 170;
const STRIP_Y = 34;
const LEG_PX = 80;

/**
 * The strip's bow after demould, w(x) = κx·x²/2 about its middle, and the corner closing in by its spring-in,
 * both drawn `factor` times exaggerated over the designed shape (dashed rule). Overlaid runs keep their
 * dash pattern (RUN_STYLES) and the corner's apex carries the run's letter.
 */
export const ShapeChart = memo(function ShapeChart({
  runs,
  factor,
  width = 320,
  fileBase,
}: {
  runs: ShapeRun[];
  factor: number;
  width?: number;
  fileBase?: string;
}) {
  const overlaid = runs.length > 1;
  const spanMm = Math.max(...runs.map((r) => r.stripSpanMm));
  const pxPerMm = (width - 20) / spanMm;
  const strip = (run: ShapeRun) => {
    const points: string[] = [];
    for (let i = 0; i <= 40; i++) {
      const xMm = -run.stripSpanMm / 2 + (run.stripSpanMm * i) / 40;
      const wMm = (run.kxPerM * (xMm / 1000) ** 2 * 1000) / 2;
      points.push(`${i ? 'L' : 'M'}${width / 2 + xMm * pxPerMm},${STRIP_Y - wMm * factor * pxPerMm}`);
    }
    return points.join('');
  };
  const apex = { x: width / 2, y: 150 };
  const legs = (angleDeg: number) => {
    const half = ((angleDeg / 2) * Math.PI) / 180;
    return `M${apex.x - LEG_PX * Math.sin(half)},${apex.y - LEG_PX * Math.cos(half)}L${apex.x},${apex.y}L${apex.x + LEG_PX * Math.sin(half)},${apex.y - LEG_PX * Math.cos(half)}`;
  };
  const designedCorners = [...new Set(runs.map((r) => r.cornerAngleDeg))];
  const runLabels = runs.map((r) => r.label);
  return (
    <ChartFigure
      title="Shape after demould"
      legend={[
        { label: 'as designed', colour: 'var(--color-rule)', dash: '4 3' },
        { label: 'strip', colour: 'var(--color-slate)' },
        { label: 'corner', colour: 'var(--color-ember)' },
      ]}
      runLabels={runLabels}
      width={width}
      height={H}
      ariaLabel={`Warped strip and corner drawn ${factor} times exaggerated${runsDescription(runLabels)}`}
      fileBase={fileBase}
      testId="chart-shape"
    >
      <line x1={10} x2={width - 10} y1={STRIP_Y} y2={STRIP_Y} stroke="var(--color-rule)" strokeDasharray="4 3" />
      {designedCorners.map((deg) => (
        <path key={deg} d={legs(deg)} fill="none" stroke="var(--color-rule)" strokeWidth={3} strokeDasharray="4 3" />
      ))}
      {runs.map((run, r) => {
        const style = RUN_STYLES[r];
        return (
          <g key={r} data-run={style.letter}>
            <path d={strip(run)} fill="none" stroke="var(--color-slate)" strokeWidth={overlaid ? 2 : 3} strokeLinecap="round" strokeDasharray={style.dash} />
            <path
              d={legs(drawnCornerDeg(run.cornerAngleDeg, run.springInDeg, factor).deg)}
              fill="none"
              stroke="var(--color-ember)"
              strokeWidth={overlaid ? 2 : 3}
              strokeLinejoin="round"
              strokeDasharray={style.dash}
            />
          </g>
        );
      })}
      <text x={10} y={STRIP_Y + 22} fontSize={10} fill="var(--color-ink-faint)">
        strip, as designed (dashed rule) and after demould
      </text>
      <text x={width / 2} y={166} textAnchor="middle" fontSize={10} fill="var(--color-ink-faint)">
        corner, as designed (dashed rule) and sprung in, ×{factor}
      </text>
    </ChartFigure>
  );
});

import { memo } from 'react';
import { useResults } from '../../stores/results-store';
import { useStudyEditor } from '../../stores/study-editor-store';
import { formatSignificant } from '../../model/format';

const W = 320;

/** The strip's bow after demould, and the corner closing in, both drawn at the exaggeration the user picks. */
export const WarpView = memo(function WarpView() {
  const result = useResults((s) => s.result);
  const factor = useResults((s) => s.exaggeration);
  const setFactor = useResults((s) => s.setExaggeration);
  const spanMm = useStudyEditor((s) => s.params?.geometry.stripSpanMm ?? 300);
  const cornerDeg = useStudyEditor((s) => s.params?.geometry.cornerAngleDeg ?? 90);
  if (!result) return <p className="text-sm text-ink-faint">No shape yet.</p>;
  const { warpageMm, springInDeg } = result.summary;
  const kx = result.curvature.kx; // 1/m

  // Strip: w(x) = κx·x²/2 about the middle, in mm, scaled so the span fills the width.
  const pxPerMm = (W - 20) / spanMm;
  const mid = 34;
  const points: string[] = [];
  for (let i = 0; i <= 40; i++) {
    const xMm = -spanMm / 2 + (spanMm * i) / 40;
    const wMm = (kx * (xMm / 1000) ** 2 * 1000) / 2;
    points.push(`${i ? 'L' : 'M'}${10 + (xMm + spanMm / 2) * pxPerMm},${mid - wMm * factor * pxPerMm}`);
  }

  // Corner: two 90 px legs from an apex; spring-in closes the angle.
  const apex = { x: W / 2, y: 150 };
  const leg = 80;
  const legs = (angleDeg: number) => {
    const half = ((angleDeg / 2) * Math.PI) / 180;
    return `M${apex.x - leg * Math.sin(half)},${apex.y - leg * Math.cos(half)}L${apex.x},${apex.y}L${apex.x + leg * Math.sin(half)},${apex.y - leg * Math.cos(half)}`;
  };
  // Past a closed corner the drawing would mean nothing: stop at 5° and say so.
  const sprungRaw = cornerDeg - springInDeg * factor;
  const sprung = Math.min(179, Math.max(5, sprungRaw));
  const clipped = sprung !== sprungRaw;

  return (
    <div data-testid="warp-view">
      <div className="mb-1 grid grid-cols-2 gap-2 text-xs">
        <p>
          <span className="block text-ink-soft">Warpage over {spanMm} mm</span>
          <span className="num text-base text-ink" data-testid="warpage-figure">
            {formatSignificant(warpageMm)} mm
          </span>
        </p>
        <p>
          <span className="block text-ink-soft">Spring-in of the {cornerDeg}° corner</span>
          <span className="num text-base text-ink" data-testid="spring-in-figure">
            {formatSignificant(springInDeg)}°
          </span>
        </p>
      </div>
      <svg width={W} height={170} role="img" aria-label={`Warped strip and corner drawn ${factor} times exaggerated`}>
        <line x1={10} x2={W - 10} y1={mid} y2={mid} stroke="var(--color-rule)" strokeDasharray="4 3" />
        <path d={points.join('')} fill="none" stroke="var(--color-slate)" strokeWidth={3} strokeLinecap="round" />
        <path d={legs(cornerDeg)} fill="none" stroke="var(--color-rule)" strokeWidth={3} strokeDasharray="4 3" />
        <path d={legs(sprung)} fill="none" stroke="var(--color-ember)" strokeWidth={3} strokeLinejoin="round" />
        <text x={10} y={mid + 22} fontSize={10} fill="var(--color-ink-faint)">
          strip, as designed (dashed) and after demould
        </text>
        <text x={W / 2} y={166} textAnchor="middle" fontSize={10} fill="var(--color-ink-faint)">
          corner, as designed (dashed) and sprung in
        </text>
      </svg>
      {clipped && <p className="text-[11px] text-saffron">Corner drawn at its limit; lower the exaggeration to see it true.</p>}
      <label className="mt-1 flex items-center gap-2 text-xs text-ink-soft">
        Exaggeration
        {/* A logarithmic slider: 0 → ×1, 3 → ×1000. */}
        <input
          type="range"
          min={0}
          max={3}
          step={0.05}
          value={Math.log10(factor)}
          onChange={(e) => setFactor(Math.round(10 ** Number(e.target.value)))}
          className="flex-1 accent-slate"
          aria-valuetext={`${factor} times`}
          data-testid="exaggeration"
        />
        <span className="num w-14 text-right">×{factor}</span>
      </label>
    </div>
  );
});

import { memo } from 'react';
import { useResults } from '../../stores/results-store';
import { useStudyEditor } from '../../stores/study-editor-store';
import { formatSignificant } from '../../model/format';
import { drawnCornerDeg, ShapeChart } from '../../../../components/charts/shape-chart';

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
  const shape = { label: 'this study', kxPerM: result.curvature.kx, springInDeg, stripSpanMm: spanMm, cornerAngleDeg: cornerDeg };
  const { clipped } = drawnCornerDeg(cornerDeg, springInDeg, factor);

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
      <ShapeChart runs={[shape]} factor={factor} width={W} fileBase="dwellform" />
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

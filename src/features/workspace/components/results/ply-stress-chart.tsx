import { memo, useMemo } from 'react';
import { PlyStressChart } from '../../../../components/charts/ply-stress-chart';
import { selectQuickLook, useResults } from '../../stores/results-store';

/** Width of the right-hand column's charts (the column is 22rem less its padding). */
const WIDTH = 328;

/**
 * Residual ply stresses after demould, from the last full solve: during a drag's quick look they stay on the
 * cycle before the drag, and say so, as the verdicts do (the key figures follow the drag). Redrawing this
 * chart for every quick look cost about a tenth of the drag's input-to-paint time.
 */
export const WorkspacePlyStress = memo(function WorkspacePlyStress() {
  const result = useResults((s) => s.fullResult);
  const quickLook = useResults(selectQuickLook);
  const runs = useMemo(() => (result ? [{ label: 'this study', result }] : []), [result]);
  if (!result || result.plyStresses.zM.length === 0) return <p className="text-sm text-ink-faint">No stresses yet.</p>;
  return (
    <div data-testid="ply-stresses">
      {quickLook && <p className="text-xs text-ink-faint">Cycle before this drag, updated on release.</p>}
      <PlyStressChart runs={runs} width={WIDTH} height={230} />
    </div>
  );
});

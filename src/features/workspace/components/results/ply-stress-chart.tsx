import { memo, useMemo } from 'react';
import { PlyStressChart } from '../../../../components/charts/ply-stress-chart';
import { useResults } from '../../stores/results-store';

/** Width of the right-hand column's charts (the column is 22rem less its padding). */
const WIDTH = 328;

/** Residual ply stresses after demould of the study on screen. */
export const WorkspacePlyStress = memo(function WorkspacePlyStress() {
  const result = useResults((s) => s.result);
  const runs = useMemo(() => (result ? [{ label: 'this study', result }] : []), [result]);
  if (!result || result.plyStresses.zM.length === 0) return <p className="text-sm text-ink-faint">No stresses yet.</p>;
  return <PlyStressChart runs={runs} width={WIDTH} height={230} />;
});

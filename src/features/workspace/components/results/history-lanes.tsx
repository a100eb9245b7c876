import { useMemo } from 'react';
import type { ResultRun } from '../../../../components/charts/history-chart';
import { CureChart, GlassChart, ModulusChart } from '../../../../components/charts/result-charts';
import { useTimeAxis } from '../../../../components/charts/time-axis';
import { resultsStore, useResults } from '../../stores/results-store';
import { useStudyEditor } from '../../stores/study-editor-store';

const LANE_HEIGHT = 118;
const scrubTo = (minutes: number) => resultsStore.getState().scrubTo(minutes);

/**
 * The result lanes under the cycle editor, all on its time axis, with the scrub line through them; pressing
 * or dragging on a lane moves the scrubber (the time the through-thickness views show).
 */
export function HistoryLanes() {
  const axis = useTimeAxis();
  const result = useResults((s) => s.result);
  const scrubMin = useResults((s) => s.scrubMin);
  const gelPoint = useStudyEditor((s) => s.params?.resin.gelPoint ?? 0.5);
  const runs = useMemo<ResultRun[]>(() => (result ? [{ label: 'this study', result, gelPoint }] : []), [result, gelPoint]);
  if (!result) return <p className="border-t border-rule p-4 text-sm text-ink-faint">Waiting for the first solve…</p>;
  const lane = { runs, axis, scrubMin, onScrub: scrubTo, height: LANE_HEIGHT, className: 'border-t border-rule' };
  return (
    <>
      <CureChart {...lane} showTimeLabels={false} />
      <GlassChart {...lane} showTimeLabels={false} />
      <ModulusChart {...lane} />
    </>
  );
}

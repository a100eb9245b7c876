import { memo, useMemo, useRef, useState, type KeyboardEvent, type PointerEvent as ReactPointerEvent, type RefObject } from 'react';
import { kToC } from '../../../../../shared/units';
import { scaleLinear, type ScaleLinear } from 'd3-scale';
import { MAX_CYCLE_MIN, type StudyParams } from '../../../../../shared/schemas/study';
import { TimeTicks, ValueTicks, useTimeAxis } from '../../../../components/charts/time-axis';
import { seriesPieces } from '../../../../components/charts/series-path';
import { PiecedPath } from '../../../../components/charts/pieced-path';
import { ScrubLine } from '../../../../components/charts/scrub-line';
import { TEMPERATURE_SERIES } from '../../../../components/charts/result-charts';
import { ChartExportControl } from '../../../../components/export/chart-export-control';
import { cycleEndMin, cycleSpans, cycleVertices, type SegmentSpan } from '../../model/cycle-geometry';
import { handleEdit, handleId, type CycleHandle, type HandleDelta } from '../../model/cycle-handles';
import { segmentNames } from '../../../../../shared/compare/segment-names';
import { issuesUnder } from '../../model/study-validation';
import { studyEditorStore, useStudyEditor } from '../../stores/study-editor-store';
import { resultsStore, useResults } from '../../stores/results-store';
import type { SimulationResult } from '../../model/simulation-result';

const PLOT_TOP = 14;
/** Pointer travel before a ramp-end drag decides whether it moves in time (rate) or temperature (target). */
const AXIS_LOCK_PX = 4;
/**
 * A drag follows raw pointer updates too, where the browser sends them: pointermove is held back to the next
 * frame, up to a frame of waiting before the solve can even start, while pointerrawupdate comes as the
 * pointer moves. The pointermove that follows with the same position then changes nothing (the edit has no
 * patches), so the two together cost one edit per position; the scheduler still starts at most one solve per
 * frame, latest wins.
 */
const MOVE_EVENTS = ['pointerrawupdate', 'pointermove'] as const;

type DragState = {
  handle: CycleHandle;
  original: StudyParams;
  startX: number;
  startY: number;
  axis: 'x' | 'y' | null;
  key: string;
};

let gestureCounter = 0;

/**
 * Keys for handles: arrows move by 1 (°C or min), Shift by 10; left and right on a ramp's end step its rate
 * instead (0.1 °C/min, Shift 1), later being slower.
 */
function keyDelta(e: KeyboardEvent, handle: CycleHandle): HandleDelta | null {
  if (handle.kind === 'ramp-end' && (e.key === 'ArrowLeft' || e.key === 'ArrowRight')) {
    const step = e.shiftKey ? 1 : 0.1;
    return { minutes: 0, celsius: 0, axis: 'x', rateStepCPerMin: e.key === 'ArrowRight' ? -step : step };
  }
  const step = e.shiftKey ? 10 : 1;
  switch (e.key) {
    case 'ArrowUp':
      return { minutes: 0, celsius: step, axis: 'y' };
    case 'ArrowDown':
      return { minutes: 0, celsius: -step, axis: 'y' };
    case 'ArrowRight':
      return { minutes: step, celsius: 0, axis: 'x' };
    case 'ArrowLeft':
      return { minutes: -step, celsius: 0, axis: 'x' };
    default:
      return null;
  }
}

/** Paths of the cycle's issues the edit would add; an edit that adds any is refused. */
function newCycleIssues(before: StudyParams, after: StudyParams): string | null {
  const had = new Set(issuesUnder(before, 'cycle').map((i) => i.path));
  const added = issuesUnder(after, 'cycle').find((i) => !had.has(i.path));
  return added ? added.message : null;
}

export function CycleEditor({
  height = 230,
  temperatureDomainC,
}: {
  height?: number;
  /** fixes the temperature scale (tests); otherwise it follows the cycle and the results */
  temperatureDomainC?: [number, number];
}) {
  const axis = useTimeAxis();
  // What is drawn: the edited study, or during a drag the step whose quick look is on screen (editor store).
  const params = useStudyEditor((s) => s.shown);
  const result = useResults((s) => s.result);
  const [refusal, setShownRefusal] = useState<string | null>(null);
  // Every drag step reports its refusal or none; only a change re-renders the editor (a repeated "none" would
  // still cost the editor a render for each step).
  const refusalRef = useRef<string | null>(null);
  const setRefusal = (next: string | null) => {
    if (refusalRef.current === next) return;
    refusalRef.current = next;
    setShownRefusal(next);
  };
  const [dragging, setDragging] = useState<string | null>(null);
  const drag = useRef<DragState | null>(null);
  /** an arrow key is held on a handle (the key repeats): a drag by keyboard until the key comes up */
  const keyGesture = useRef(false);
  const svgRef = useRef<SVGSVGElement>(null);
  const frozenDomain = useRef<[number, number] | null>(null);
  const plotHeight = height - PLOT_TOP - 30;

  const cycle = params?.cycle;
  const spans = useMemo(() => (cycle?.kind === 'segments' ? cycleSpans(cycle.startC, cycle.segments) : []), [cycle]);
  const names = useMemo(() => (cycle?.kind === 'segments' ? segmentNames(cycle.segments) : []), [cycle]);

  const domain = useMemo((): [number, number] => {
    if (temperatureDomainC) return temperatureDomainC;
    let hi = 0;
    let lo = 0;
    for (const s of spans) hi = Math.max(hi, s.startC, s.endC);
    for (const s of spans) lo = Math.min(lo, s.startC, s.endC);
    if (result) {
      const mid = result.history.midPlaneK;
      for (let i = 0; i < mid.length; i++) hi = Math.max(hi, kToC(mid[i]));
    }
    let next: [number, number] = [Math.floor(lo / 50) * 50, Math.ceil((hi + 25) / 50) * 50];
    const held = frozenDomain.current;
    // Hold the scale still under a dragging pointer; only grow it when a handle would leave the plot.
    if (dragging && held) next = [Math.min(held[0], next[0]), Math.max(held[1], next[1])];
    // The same range keeps the same scale object, so the traces (memoised on it) skip an edit that moves no axis.
    return held && held[0] === next[0] && held[1] === next[1] ? held : next;
  }, [spans, result, dragging, temperatureDomainC]);
  frozenDomain.current = domain;

  const y = useMemo(() => scaleLinear().domain(domain).range([plotHeight, 0]), [domain, plotHeight]);

  if (!params || !cycle) return null;
  if (cycle.kind !== 'segments') {
    return (
      <p className="p-3 text-sm text-ink-soft">
        This study follows a recorded cycle; its points are edited in the table. The line editor works on ramp, dwell
        and cool segments.
      </p>
    );
  }

  const pxPerMin = axis.x(1) - axis.x(0);
  const pxPerC = y(0) - y(1);

  /** `inputAt`: the event's timeStamp, where the input-to-paint measure starts. */
  function apply(handle: CycleHandle, original: StudyParams, delta: HandleDelta, key: string, gesture: boolean, inputAt: number) {
    if (studyEditorStore.getState().meta?.readOnly) {
      setRefusal('This is an earlier revision, read only: restore it as a new revision to change it.');
      return;
    }
    const edit = handleEdit(original, handle, delta);
    if (!edit.ok) {
      setRefusal(edit.reason);
      return;
    }
    // The store produces the edited study once; it is checked, and validated, before it is kept.
    const refused = studyEditorStore.getState().edit(edit.label, edit.recipe, {
      coalesceKey: key,
      gesture,
      inputAt,
      refuse: (next, current) => {
        const problem = newCycleIssues(current, next);
        return problem ? `Not applied: ${problem}` : null;
      },
    });
    setRefusal(refused);
  }

  function onHandlePointerDown(e: ReactPointerEvent<SVGGElement>, handle: CycleHandle) {
    if (e.button !== 0) return;
    // A drag that leaves the chart must not select the text it passes over (the setup column): no default
    // action for this press, the pointer kept by the handle until release, and no selection started meanwhile.
    e.preventDefault();
    e.stopPropagation();
    e.currentTarget.setPointerCapture?.(e.pointerId);
    window.getSelection()?.removeAllRanges();
    (e.currentTarget as Element & { focus?: () => void }).focus?.();
    gestureCounter += 1;
    drag.current = {
      handle,
      original: studyEditorStore.getState().params!,
      startX: e.clientX,
      startY: e.clientY,
      axis: handle.kind === 'ramp-end' ? null : handle.kind === 'dwell-end' ? 'x' : 'y',
      key: `drag-${gestureCounter}`,
    };
    setDragging(handleId(handle));
    resultsStore.getState().setDragging(true);

    const onMove = (event: Event) => {
      const ev = event as PointerEvent;
      const d = drag.current;
      if (!d) return;
      const dx = ev.clientX - d.startX;
      const dy = ev.clientY - d.startY;
      if (d.axis === null) {
        if (Math.max(Math.abs(dx), Math.abs(dy)) < AXIS_LOCK_PX) return;
        d.axis = Math.abs(dx) >= Math.abs(dy) ? 'x' : 'y';
      }
      apply(d.handle, d.original, { minutes: dx / pxPerMin, celsius: -dy / pxPerC, axis: d.axis }, d.key, true, ev.timeStamp);
    };
    const noSelect = (ev: Event) => ev.preventDefault();
    // The drag ends on release, on a cancelled pointer, or when the window loses focus mid-drag (no release comes).
    const onUp = () => {
      drag.current = null;
      document.removeEventListener('selectstart', noSelect);
      setDragging(null);
      resultsStore.getState().setDragging(false);
      for (const type of MOVE_EVENTS) window.removeEventListener(type, onMove);
      window.removeEventListener('pointerup', onUp);
      window.removeEventListener('pointercancel', onUp);
      window.removeEventListener('blur', onUp);
    };
    document.addEventListener('selectstart', noSelect);
    for (const type of MOVE_EVENTS) window.addEventListener(type, onMove);
    window.addEventListener('pointerup', onUp);
    window.addEventListener('pointercancel', onUp);
    window.addEventListener('blur', onUp);
  }

  function onHandleKeyDown(e: KeyboardEvent<SVGGElement>, handle: CycleHandle) {
    const delta = keyDelta(e, handle);
    if (!delta) return;
    e.preventDefault();
    if (handle.kind === 'dwell-end' && delta.axis !== 'x') return;
    if (handle.kind === 'dwell-level' && delta.axis !== 'y') return;
    // One press solves in full; a held key repeats like a drag, with quick looks until the key comes up.
    if (e.repeat && !keyGesture.current && !drag.current) {
      keyGesture.current = true;
      setDragging(handleId(handle));
      resultsStore.getState().setDragging(true);
    }
    apply(handle, studyEditorStore.getState().params!, delta, `keys-${handleId(handle)}`, false, e.timeStamp);
  }

  /** Key up or focus gone: a held-key drag ends (and its last step is solved in full). */
  function endKeyGesture() {
    if (!keyGesture.current) return;
    keyGesture.current = false;
    setDragging(null);
    resultsStore.getState().setDragging(false);
  }

  function onPlotPointerDown(e: ReactPointerEvent<SVGRectElement>) {
    e.preventDefault();
    const rect = e.currentTarget.getBoundingClientRect();
    resultsStore.getState().scrubTo(axis.x.invert(e.clientX - rect.left));
  }

  // One path per segment: a drag rewrites the segments from the dragged one on, and those before keep their text.
  const vertices = cycleVertices(cycle.startC, spans);
  const setpointDs = vertices.slice(1).map((v, i) => `M${axis.x(vertices[i].timeMin)},${y(vertices[i].tempC)}L${axis.x(v.timeMin)},${y(v.tempC)}`);

  return (
    <div className="paint-island relative">
      <svg
        ref={svgRef}
        width={axis.width}
        height={height}
        role="group"
        aria-label="Cure cycle: set point against time, with draggable handles"
        className="block touch-none select-none"
        data-testid="cycle-editor"
      >
        <g transform={`translate(${axis.marginLeft},${PLOT_TOP})`}>
          <ValueTicks y={y} width={axis.plotWidth} unit="°C" />
          <TimeTicks height={plotHeight} />
          <rect
            width={axis.plotWidth}
            height={plotHeight}
            fill="transparent"
            onPointerDown={onPlotPointerDown}
            data-testid="cycle-plot"
          />
          <SegmentBands spans={spans} x={axis.x} height={plotHeight} />
          {result && <ThermalTraces result={result} x={axis.x} y={y} />}
          <g fill="none" stroke="var(--color-ink)" strokeWidth={1.6} strokeDasharray="6 3" data-testid="set-point">
            {setpointDs.map((d, i) => (
              <path key={i} d={d} />
            ))}
          </g>
          <StoreScrubLine x={axis.x} height={plotHeight} />
          {spans.map((span) => (
            <SpanHandles
              key={span.index}
              span={span}
              name={names[span.index]}
              x={axis.x}
              y={y}
              dragging={dragging}
              rate={(cycle.segments[span.index] as { rateCPerMin?: number }).rateCPerMin}
              cycleMin={cycleEndMin(spans)}
              onPointerDown={onHandlePointerDown}
              onKeyDown={onHandleKeyDown}
              onKeyGestureEnd={endKeyGesture}
            />
          ))}
        </g>
      </svg>
      <ThermalLegend target={svgRef} />
      <p role="status" aria-live="polite" className="min-h-5 px-2 text-xs text-fault" data-testid="cycle-refusal">
        {refusal}
      </p>
    </div>
  );
}

function SegmentBands({ spans, x, height }: { spans: SegmentSpan[]; x: ScaleLinear<number, number>; height: number }) {
  return (
    <g aria-hidden>
      {spans
        .filter((s) => s.kind === 'hold')
        .map((s) => (
          <rect
            key={s.index}
            x={x(s.startMin)}
            width={Math.max(0, x(s.endMin) - x(s.startMin))}
            y={0}
            height={height}
            fill="var(--color-saffron-soft)"
            opacity={0.45}
            pointerEvents="none"
          />
        ))}
    </g>
  );
}

const ThermalTraces = memo(function ThermalTraces({
  result,
  x,
  y,
}: {
  result: SimulationResult;
  x: ScaleLinear<number, number>;
  y: ScaleLinear<number, number>;
}) {
  const t = result.history.timeS;
  const toX = (s: number) => x(s / 60);
  const toY = (k: number) => y(kToC(k));
  // In pieces: a drag rewrites and repaints each trace from the edited moment on only.
  return (
    <g aria-hidden pointerEvents="none" data-testid="thermal-traces">
      {TEMPERATURE_SERIES.map((tr) => (
        <PiecedPath key={tr.label} pieces={seriesPieces(t, tr.pick(result.history), toX, toY)} fill="none" stroke={tr.colour} strokeWidth={tr.strokeWidth} />
      ))}
      {Array.from(result.segmentBoundsS).map((s, i) => (
        <line key={i} x1={toX(s)} x2={toX(s)} y1={y.range()[0]} y2={y.range()[0] - 6} stroke="var(--color-ink-faint)" />
      ))}
    </g>
  );
});

function ThermalLegend({ target }: { target: RefObject<SVGSVGElement | null> }) {
  return (
    <ul className="flex flex-wrap gap-x-4 gap-y-1 px-2 text-xs text-ink-soft" aria-label="Line key">
      <li className="flex items-center gap-1.5">
        <svg width="18" height="6" aria-hidden>
          <line x1="0" x2="18" y1="3" y2="3" stroke="var(--color-ink)" strokeWidth="1.6" strokeDasharray="4 2" />
        </svg>
        set point (drag the handles)
      </li>
      {TEMPERATURE_SERIES.map((tr) => (
        <li key={tr.label} className="flex items-center gap-1.5">
          <svg width="18" height="6" aria-hidden>
            <line x1="0" x2="18" y1="3" y2="3" stroke={tr.colour} strokeWidth={(tr.strokeWidth ?? 1.6) + 0.6} />
          </svg>
          {tr.label}
        </li>
      ))}
      <li className="flex items-center gap-1.5">
        <span aria-hidden className="inline-block h-2.5 w-4 bg-saffron-soft" /> dwell
      </li>
      <li className="ml-auto">
        <ChartExportControl target={target} fileBase="dwellform-cure-cycle-and-temperatures" title="Cure cycle and temperatures" />
      </li>
    </ul>
  );
}

/** The scrubbed time through the editor, following the results store without re-rendering the editor. */
function StoreScrubLine({ x, height }: { x: ScaleLinear<number, number>; height: number }) {
  const scrubMin = useResults((s) => s.scrubMin);
  return <ScrubLine x={x} minutes={scrubMin} height={height} />;
}

type HandleProps = {
  span: SegmentSpan;
  name: string;
  x: ScaleLinear<number, number>;
  y: ScaleLinear<number, number>;
  dragging: string | null;
  rate: number | undefined;
  /** the drawn cycle's length, which bounds how long a dwell can grow */
  cycleMin: number;
  onPointerDown: (e: ReactPointerEvent<SVGGElement>, h: CycleHandle) => void;
  onKeyDown: (e: KeyboardEvent<SVGGElement>, h: CycleHandle) => void;
  onKeyGestureEnd: () => void;
};

/** Handle shapes say which way they move: a diamond moves both ways, bars move across their length. */
function SpanHandles({ span, name, x, y, dragging, rate, cycleMin, onPointerDown, onKeyDown, onKeyGestureEnd }: HandleProps) {
  // Temperatures range over the plot's scale (where the handle can be dragged to); a dwell from 1 min up to
  // what the cycle's length allows.
  const [lowC, highC] = y.domain();
  if (span.kind === 'hold') {
    const level: CycleHandle = { kind: 'dwell-level', index: span.index };
    const end: CycleHandle = { kind: 'dwell-end', index: span.index };
    const minutes = Math.round((span.endMin - span.startMin) * 10) / 10;
    const cx = x((span.startMin + span.endMin) / 2);
    const cy = y(span.startC);
    return (
      <>
        <Handle
          handle={level}
          active={dragging === handleId(level)}
          label={`${name} temperature`}
          hint="arrow up or down changes the dwell temperature"
          valueNow={span.startC}
          valueMin={lowC}
          valueMax={highC}
          valueText={`${span.startC} °C`}
          onPointerDown={onPointerDown}
          onKeyDown={onKeyDown}
          onKeyGestureEnd={onKeyGestureEnd}
          cursor="ns-resize"
        >
          <rect x={cx - 11} y={cy - 4} width={22} height={8} rx={3} />
        </Handle>
        <Handle
          handle={end}
          active={dragging === handleId(end)}
          label={`${name} end`}
          hint="arrow left or right changes the dwell length"
          valueNow={minutes}
          valueMin={1}
          valueMax={Math.max(minutes, Math.floor(MAX_CYCLE_MIN - (cycleMin - minutes)))}
          valueText={`${minutes} min`}
          onPointerDown={onPointerDown}
          onKeyDown={onKeyDown}
          onKeyGestureEnd={onKeyGestureEnd}
          cursor="ew-resize"
        >
          <rect x={x(span.endMin) - 4} y={cy - 11} width={8} height={22} rx={3} />
        </Handle>
      </>
    );
  }
  const h: CycleHandle = { kind: 'ramp-end', index: span.index };
  const px = x(span.endMin);
  const py = y(span.endC);
  return (
    <Handle
      handle={h}
      active={dragging === handleId(h)}
      label={`${name} end`}
      hint="arrow up or down changes the target by 1 °C, left or right the rate by 0.1 °C/min (Shift: 10 °C, 1 °C/min)"
      valueNow={span.endC}
      valueMin={lowC}
      valueMax={highC}
      valueText={`${span.endC} °C at ${rate ?? '?'} °C/min`}
      onPointerDown={onPointerDown}
      onKeyDown={onKeyDown}
      onKeyGestureEnd={onKeyGestureEnd}
      cursor="move"
    >
      <path d={`M${px},${py - 8}L${px + 8},${py}L${px},${py + 8}L${px - 8},${py}Z`} />
    </Handle>
  );
}

function Handle({
  handle,
  active,
  label,
  hint,
  valueNow,
  valueMin,
  valueMax,
  valueText,
  onPointerDown,
  onKeyDown,
  onKeyGestureEnd,
  cursor,
  children,
}: {
  handle: CycleHandle;
  active: boolean;
  label: string;
  hint: string;
  valueNow: number;
  valueMin: number;
  valueMax: number;
  valueText: string;
  onPointerDown: HandleProps['onPointerDown'];
  onKeyDown: HandleProps['onKeyDown'];
  onKeyGestureEnd: HandleProps['onKeyGestureEnd'];
  cursor: string;
  children: React.ReactNode;
}) {
  return (
    <g
      role="slider"
      tabIndex={0}
      aria-label={label}
      aria-description={hint}
      aria-valuenow={valueNow}
      aria-valuemin={valueMin}
      aria-valuemax={valueMax}
      aria-valuetext={valueText}
      data-handle={handleId(handle)}
      data-export="skip"
      className="outline-none [&:focus-visible>*]:stroke-slate [&:focus-visible>*]:[stroke-width:3]"
      style={{ cursor }}
      fill={active ? 'var(--color-ember)' : 'var(--color-paper-raised)'}
      stroke="var(--color-ink)"
      strokeWidth={1.5}
      onPointerDown={(e) => onPointerDown(e, handle)}
      onKeyDown={(e) => onKeyDown(e, handle)}
      onKeyUp={onKeyGestureEnd}
      onBlur={onKeyGestureEnd}
    >
      {children}
    </g>
  );
}

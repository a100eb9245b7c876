// @vitest-environment jsdom
import { beforeEach, describe, expect, it } from 'vitest';
import { fireEvent, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { referenceStudy } from '../../../../../shared/solver/demo-cards';
import type { CycleSegment } from '../../../../../shared/schemas/study';
import { CHART_MARGIN, TimeAxisProvider, makeTimeAxis } from '../../../../components/charts/time-axis';
import { studyEditorStore } from '../../stores/study-editor-store';
import { CycleEditor } from './cycle-editor';

// A plot 600 px wide for 600 min and 250 px tall for 250 °C: one pixel is one minute or one degree,
// so the expected changes below follow from the pointer travel alone.
const PLOT_PX = 600;
const width = PLOT_PX + CHART_MARGIN.left + CHART_MARGIN.right;
const PLOT_TOP_AND_BOTTOM = 14 + 30;

function renderEditor() {
  return render(
    <TimeAxisProvider axis={makeTimeAxis([0, 600], width)}>
      <CycleEditor height={250 + PLOT_TOP_AND_BOTTOM} temperatureDomainC={[0, 250]} />
    </TimeAxisProvider>,
  );
}

const segments = (): CycleSegment[] => {
  const c = studyEditorStore.getState().params!.cycle;
  if (c.kind !== 'segments') throw new Error('expected segments');
  return c.segments;
};

/** Several small moves by default, as a hand makes them; the result must depend only on the total travel. */
function drag(handle: Element, dx: number, dy: number, steps = 5) {
  fireEvent.pointerDown(handle, { clientX: 200, clientY: 100, button: 0, pointerId: 1 });
  for (let i = 1; i <= steps; i++) {
    fireEvent.pointerMove(window, { clientX: 200 + (dx * i) / steps, clientY: 100 + (dy * i) / steps, pointerId: 1 });
  }
  fireEvent.pointerUp(window, { clientX: 200 + dx, clientY: 100 + dy, pointerId: 1 });
}

describe('cycle editor', () => {
  beforeEach(() => {
    // Reference cycle: ramp 2 °C/min to 120, dwell 90 min, ramp 1.5 °C/min to 180, dwell 120 min, cool 2 °C/min to 60.
    studyEditorStore.getState().load({ studyId: 'test', name: 'test', baseRevision: 1 }, referenceStudy());
  });

  it('dragging a dwell’s right edge 40 px lengthens that dwell by 40 min and leaves the rest alone', () => {
    renderEditor();
    const before = segments();
    drag(screen.getByRole('slider', { name: 'Dwell 1 end' }), 40, 3);
    const after = segments();
    expect(after[1]).toMatchObject({ kind: 'hold', holdMin: (before[1] as { holdMin: number }).holdMin + 40 });
    expect(after.filter((_, i) => i !== 1)).toEqual(before.filter((_, i) => i !== 1));
    // One drag is one undo step.
    studyEditorStore.getState().undo();
    expect(segments()).toEqual(before);
  });

  it('follows raw pointer updates, and the aligned pointermove after one at the same place edits nothing more', () => {
    renderEditor();
    const before = segments();
    const handle = screen.getByRole('slider', { name: 'Dwell 1 end' });
    fireEvent.pointerDown(handle, { clientX: 200, clientY: 100, button: 0, pointerId: 1 });
    // The raw update alone moves the dwell (a browser sends it before the frame-aligned pointermove)…
    window.dispatchEvent(new MouseEvent('pointerrawupdate', { clientX: 230, clientY: 101 }));
    expect(segments()[1]).toMatchObject({ holdMin: (before[1] as { holdMin: number }).holdMin + 30 });
    const seq = studyEditorStore.getState().inputSeq;
    // …and the pointermove at the same position that follows is not a second edit (no second solve).
    fireEvent.pointerMove(window, { clientX: 230, clientY: 101, pointerId: 1 });
    expect(studyEditorStore.getState().inputSeq).toBe(seq);
    fireEvent.pointerUp(window, { clientX: 230, clientY: 101, pointerId: 1 });
    expect(segments()[1]).toMatchObject({ holdMin: (before[1] as { holdMin: number }).holdMin + 30 });
  });

  it('dragging a dwell up 15 px raises the target of the ramp that leads into it by 15 °C', () => {
    renderEditor();
    drag(screen.getByRole('slider', { name: 'Dwell 2 temperature' }), 2, -15);
    expect(segments()[2]).toMatchObject({ kind: 'ramp', targetC: 195, rateCPerMin: 1.5 });
  });

  it('dragging a ramp’s end sideways changes its rate so it reaches the same target later', () => {
    renderEditor();
    // 20 → 120 °C at 2 °C/min takes 50 min; 50 px to the right makes it 100 min, so 1 °C/min.
    drag(screen.getByRole('slider', { name: 'Ramp 1 end' }), 50, 1);
    expect(segments()[0]).toMatchObject({ kind: 'ramp', targetC: 120, rateCPerMin: 1 });
  });

  it('refuses a drag that would make the next ramp go downhill, says why, and changes nothing', () => {
    renderEditor();
    const before = structuredClone(studyEditorStore.getState().params);
    // Dwell 1 at 120 °C raised by 70 °C would sit above the 180 °C the next ramp heads for.
    drag(screen.getByRole('slider', { name: 'Dwell 1 temperature' }), 0, -70, 1);
    expect(studyEditorStore.getState().params).toEqual(before);
    expect(screen.getByTestId('cycle-refusal').textContent).toMatch(/Not applied: ramp target 180 °C is out of range: allowed > 190 °C/);
  });

  it('a drag that runs into a refused position stays at the last accepted one', () => {
    renderEditor();
    // Moves of 14 px: 134, 148, 162, 176 °C are accepted; 190 °C is refused.
    drag(screen.getByRole('slider', { name: 'Dwell 1 temperature' }), 0, -70, 5);
    expect(segments()[0]).toMatchObject({ targetC: 176 });
    expect(screen.getByTestId('cycle-refusal').textContent).toMatch(/Not applied/);
  });

  it('refuses shrinking a dwell to nothing, with a message', () => {
    renderEditor();
    drag(screen.getByRole('slider', { name: 'Dwell 1 end' }), -105, 0, 1);
    expect(segments()[1]).toMatchObject({ holdMin: 90 });
    expect(screen.getByTestId('cycle-refusal').textContent).toMatch(/Dwell 1: a dwell of -15 min is not a dwell/);
  });

  it('arrow keys on a focused handle nudge it: up raises a ramp’s target, right lengthens a dwell', async () => {
    const user = userEvent.setup();
    renderEditor();
    screen.getByRole('slider', { name: 'Ramp 1 end' }).focus();
    await user.keyboard('{ArrowUp}{ArrowUp}{ArrowUp}');
    expect(segments()[0]).toMatchObject({ targetC: 123 });
    screen.getByRole('slider', { name: 'Dwell 2 end' }).focus();
    await user.keyboard('{Shift>}{ArrowRight}{/Shift}');
    expect(segments()[3]).toMatchObject({ holdMin: 130 });
  });
});

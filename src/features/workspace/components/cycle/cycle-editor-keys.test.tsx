// @vitest-environment jsdom
import { beforeEach, describe, expect, it } from 'vitest';
import { fireEvent, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { referenceStudy } from '../../../../../shared/solver/demo-cards';
import type { CycleSegment } from '../../../../../shared/schemas/study';
import { CHART_MARGIN, TimeAxisProvider, makeTimeAxis } from '../../../../components/charts/time-axis';
import { resultsStore } from '../../stores/results-store';
import { studyEditorStore } from '../../stores/study-editor-store';
import { CycleEditor } from './cycle-editor';

// The reference study's numbers move with the demo cards, so these checks compare against the loaded values.
function renderEditor() {
  return render(
    <TimeAxisProvider axis={makeTimeAxis([0, 600], 600 + CHART_MARGIN.left + CHART_MARGIN.right)}>
      <CycleEditor height={294} temperatureDomainC={[0, 250]} />
    </TimeAxisProvider>,
  );
}

const segments = (): CycleSegment[] => {
  const c = studyEditorStore.getState().params!.cycle;
  if (c.kind !== 'segments') throw new Error('expected segments');
  return c.segments;
};
const rateOf = (i: number) => (segments()[i] as { rateCPerMin: number }).rateCPerMin;
const round1 = (v: number) => Math.round(v * 10) / 10;

describe('cycle editor keys on a ramp’s end', () => {
  beforeEach(() => {
    studyEditorStore.getState().load({ studyId: 'test', name: 'test', baseRevision: 1 }, referenceStudy());
  });

  it('left and right step the rate by 0.1 °C/min, later being slower; Shift steps by 1', async () => {
    const user = userEvent.setup();
    renderEditor();
    const rate0 = rateOf(2);
    const target0 = (segments()[2] as { targetC: number }).targetC;
    screen.getByRole('slider', { name: 'Ramp 2 end' }).focus();
    await user.keyboard('{ArrowRight}');
    expect(rateOf(2)).toBe(round1(rate0 - 0.1));
    await user.keyboard('{ArrowLeft}{ArrowLeft}');
    expect(rateOf(2)).toBe(round1(rate0 + 0.1));
    await user.keyboard('{Shift>}{ArrowLeft}{/Shift}');
    expect(rateOf(2)).toBe(round1(rate0 + 1.1));
    // the target stays where it was
    expect(segments()[2]).toMatchObject({ targetC: target0 });
  });

  it('refuses a rate stepped to zero, with a message, and keeps the last rate', async () => {
    const user = userEvent.setup();
    studyEditorStore.getState().edit('slow', (d) => {
      if (d.cycle.kind === 'segments') (d.cycle.segments[0] as { rateCPerMin: number }).rateCPerMin = 0.2;
    });
    renderEditor();
    screen.getByRole('slider', { name: 'Ramp 1 end' }).focus();
    await user.keyboard('{ArrowRight}');
    expect(rateOf(0)).toBe(0.1);
    await user.keyboard('{ArrowRight}');
    expect(rateOf(0)).toBe(0.1);
    expect(screen.getByTestId('cycle-refusal').textContent).toMatch(/Ramp 1: the rate would be 0 °C\/min: allowed > 0 °C\/min/);
  });

  it('up and down still move the target by 1 °C, and a dwell’s end still moves by 1 min', async () => {
    const user = userEvent.setup();
    renderEditor();
    const target0 = (segments()[0] as { targetC: number }).targetC;
    const hold0 = (segments()[1] as { holdMin: number }).holdMin;
    screen.getByRole('slider', { name: 'Ramp 1 end' }).focus();
    await user.keyboard('{ArrowDown}');
    expect(segments()[0]).toMatchObject({ targetC: target0 - 1 });
    screen.getByRole('slider', { name: 'Dwell 1 end' }).focus();
    await user.keyboard('{ArrowRight}');
    expect(segments()[1]).toMatchObject({ holdMin: hold0 + 1 });
  });
});

describe('cycle handles as sliders', () => {
  beforeEach(() => {
    studyEditorStore.getState().load({ studyId: 'test', name: 'test', baseRevision: 1 }, referenceStudy());
  });

  it('each states its value, its range and its value in words with the unit', () => {
    renderEditor();
    const target = (segments()[0] as { targetC: number }).targetC;
    const rate = rateOf(0);
    const hold = (segments()[1] as { holdMin: number }).holdMin;
    for (const slider of screen.getAllByRole('slider')) {
      const now = Number(slider.getAttribute('aria-valuenow'));
      expect(now).toBeGreaterThanOrEqual(Number(slider.getAttribute('aria-valuemin')));
      expect(now).toBeLessThanOrEqual(Number(slider.getAttribute('aria-valuemax')));
      expect(slider.getAttribute('aria-valuetext')).toMatch(/ (°C|min)/);
    }
    const rampEnd = screen.getByRole('slider', { name: 'Ramp 1 end' });
    expect(rampEnd.getAttribute('aria-valuenow')).toBe(String(target));
    expect(rampEnd.getAttribute('aria-valuemin')).toBe('0');
    expect(rampEnd.getAttribute('aria-valuemax')).toBe('250');
    expect(rampEnd.getAttribute('aria-valuetext')).toBe(`${target} °C at ${rate} °C/min`);
    const dwellEnd = screen.getByRole('slider', { name: 'Dwell 1 end' });
    expect(dwellEnd.getAttribute('aria-valuetext')).toBe(`${hold} min`);
    expect(dwellEnd.getAttribute('aria-valuemin')).toBe('1');
  });
});

describe('dragging a handle', () => {
  beforeEach(() => {
    studyEditorStore.getState().load({ studyId: 'test', name: 'test', baseRevision: 1 }, referenceStudy());
  });

  it('takes the pointer and starts no text selection, until released', () => {
    renderEditor();
    const handle = screen.getByRole('slider', { name: 'Dwell 1 end' });
    const captured: number[] = [];
    (handle as unknown as { setPointerCapture: (id: number) => void }).setPointerCapture = (id) => captured.push(id);
    // fireEvent returns false when a listener called preventDefault
    expect(fireEvent.pointerDown(handle, { clientX: 200, clientY: 100, button: 0, pointerId: 7 })).toBe(false);
    expect(captured).toEqual([7]);
    expect(fireEvent(document, new Event('selectstart', { bubbles: true, cancelable: true }))).toBe(false);
    fireEvent.pointerUp(window, { clientX: 200, clientY: 100, pointerId: 7 });
    expect(fireEvent(document, new Event('selectstart', { bubbles: true, cancelable: true }))).toBe(true);
  });
});

describe('a drag in progress (solved as quick looks until it ends)', () => {
  beforeEach(() => {
    studyEditorStore.getState().load({ studyId: 'test', name: 'test', baseRevision: 1 }, referenceStudy());
    resultsStore.getState().reset();
  });
  const dragging = () => resultsStore.getState().dragging;
  const holdMin = (i: number) => (segments()[i] as { holdMin: number }).holdMin;

  it('a single arrow press is not a drag; a held (repeating) arrow is one until the key comes up', () => {
    renderEditor();
    const handle = screen.getByRole('slider', { name: 'Dwell 1 end' });
    const hold0 = holdMin(1);
    fireEvent.keyDown(handle, { key: 'ArrowRight' });
    expect(dragging()).toBe(false);
    fireEvent.keyUp(handle, { key: 'ArrowRight' });
    fireEvent.keyDown(handle, { key: 'ArrowRight' });
    fireEvent.keyDown(handle, { key: 'ArrowRight', repeat: true });
    expect(dragging()).toBe(true);
    fireEvent.keyDown(handle, { key: 'ArrowRight', repeat: true });
    expect(holdMin(1)).toBe(hold0 + 4);
    fireEvent.keyUp(handle, { key: 'ArrowRight' });
    expect(dragging()).toBe(false);
  });

  it('a held arrow ends when focus leaves the handle; a pointer drag ends when the window loses focus', () => {
    renderEditor();
    const handle = screen.getByRole('slider', { name: 'Dwell 1 end' });
    fireEvent.keyDown(handle, { key: 'ArrowLeft', repeat: true });
    expect(dragging()).toBe(true);
    fireEvent.blur(handle);
    expect(dragging()).toBe(false);
    fireEvent.pointerDown(handle, { clientX: 200, clientY: 100, button: 0, pointerId: 3 });
    expect(dragging()).toBe(true);
    fireEvent(window, new Event('blur'));
    expect(dragging()).toBe(false);
  });
});

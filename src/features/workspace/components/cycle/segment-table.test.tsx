// @vitest-environment jsdom
import { beforeEach, describe, expect, it } from 'vitest';
import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { referenceStudy } from '../../../../../shared/solver/demo-cards';
import { studyEditorStore } from '../../stores/study-editor-store';
import { validationOf } from '../../model/study-validation';
import { SegmentTable } from './segment-table';

const ramp1 = () => {
  const c = studyEditorStore.getState().params!.cycle;
  return c.kind === 'segments' ? c.segments[0] : null;
};

describe('segment table', () => {
  beforeEach(() => {
    studyEditorStore.getState().load({ studyId: 'test', name: 'test', baseRevision: 1 }, referenceStudy());
  });

  it('marks a ramp rate above the schema’s limit in place with the reason, and the study is then invalid', async () => {
    const user = userEvent.setup();
    render(<SegmentTable />);
    const rate = screen.getByLabelText('Ramp 1 rate');
    await user.clear(rate);
    await user.type(rate, '25');
    expect(rate.getAttribute('aria-invalid')).toBe('true');
    // The shared schema allows ramp rates > 0 and ≤ 20 °C/min.
    expect(screen.getByRole('alert').textContent).toMatch(/^25 °C\/min is out of range: allowed > 0.* and ≤ 20 °C\/min$/);
    expect(validationOf(studyEditorStore.getState().params!).ok).toBe(false);
  });

  it('keeps text that is not a number out of the study and says so', async () => {
    const user = userEvent.setup();
    render(<SegmentTable />);
    const rate = screen.getByLabelText('Ramp 1 rate');
    await user.clear(rate);
    await user.type(rate, 'fast');
    expect(screen.getByRole('alert').textContent).toBe('"fast" is not a number');
    expect(ramp1()).toMatchObject({ rateCPerMin: 2 });
  });

  it('splits a ramp into two that meet halfway and removes a segment', async () => {
    const user = userEvent.setup();
    render(<SegmentTable />);
    await user.click(screen.getByRole('button', { name: 'Split Ramp 1' }));
    const c = studyEditorStore.getState().params!.cycle;
    if (c.kind !== 'segments') throw new Error('expected segments');
    // 20 → 120 °C split at the mean temperature, 70 °C, both halves at the original rate.
    expect(c.segments.slice(0, 2)).toMatchObject([
      { kind: 'ramp', targetC: 70, rateCPerMin: 2 },
      { kind: 'ramp', targetC: 120, rateCPerMin: 2 },
    ]);
    await user.click(screen.getByRole('button', { name: 'Remove Ramp 2' }));
    const after = studyEditorStore.getState().params!.cycle;
    expect(after.kind === 'segments' && after.segments.length).toBe(5);
  });

  it('disables the band of a dwell that starts on the clock, says why, and enables it for a lagging-part start', async () => {
    const user = userEvent.setup();
    render(<SegmentTable />);
    await user.selectOptions(screen.getByLabelText('Dwell 1 starts'), 'clock');
    const band = screen.getByLabelText('Dwell 1 band') as HTMLInputElement;
    expect(band.disabled).toBe(true);
    expect(document.getElementById(band.getAttribute('aria-describedby')!)!.textContent).toBe('not used: this dwell starts on the clock');
    await user.selectOptions(screen.getByLabelText('Dwell 1 starts'), 'lagging-part');
    expect((screen.getByLabelText('Dwell 1 band') as HTMLInputElement).disabled).toBe(false);
  });
});

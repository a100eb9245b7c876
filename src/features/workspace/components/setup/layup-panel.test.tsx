// @vitest-environment jsdom
import { beforeEach, describe, expect, it } from 'vitest';
import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { referenceStudy } from '../../../../../shared/solver/demo-cards';
import { studyEditorStore } from '../../stores/study-editor-store';
import { LayupPanel } from './layup-panel';

const angles = () => studyEditorStore.getState().params!.layup.plies.map((p) => p.angleDeg);

describe('layup panel', () => {
  beforeEach(() => {
    const params = referenceStudy();
    params.layup.plies = [0, 45, 90].map((angleDeg) => ({ angleDeg, thicknessMm: 0.2 }));
    studyEditorStore.getState().load({ studyId: 'test', name: 'test', baseRevision: 1 }, params);
  });

  it('moves a ply with Alt+arrow keys from its row and with the row buttons', async () => {
    const user = userEvent.setup();
    render(<LayupPanel />);
    // Ply 1 (0°, on the tool) moves one place toward the bag.
    await user.click(screen.getByLabelText('Ply 1 angle'));
    await user.keyboard('{Alt>}{ArrowUp}{/Alt}');
    expect(angles()).toEqual([45, 0, 90]);
    await user.click(screen.getByRole('button', { name: 'Move ply 3 toward the tool' }));
    expect(angles()).toEqual([45, 90, 0]);
  });

  it('mirrors the stack into a symmetric laminate and applies presets', async () => {
    const user = userEvent.setup();
    render(<LayupPanel />);
    expect(screen.getByTestId('layup-symmetry').textContent).toMatch(/unsymmetric/);
    await user.click(screen.getByRole('button', { name: 'Mirror → 6 plies' }));
    expect(angles()).toEqual([0, 45, 90, 90, 45, 0]);
    expect(screen.getByTestId('layup-symmetry').textContent).toBe('symmetric');

    // Cross-ply [0/90]ns comes in multiples of 4 plies: 6 wanted rounds to 8.
    await user.selectOptions(screen.getByLabelText('Preset'), 'cross-ply');
    await user.click(screen.getByRole('button', { name: /Apply/ }));
    expect(angles()).toEqual([0, 90, 0, 90, 90, 0, 90, 0]);
    studyEditorStore.getState().undo();
    expect(angles()).toEqual([0, 45, 90, 90, 45, 0]);
  });

  it('marks a ply angle outside ±90° in place', async () => {
    const user = userEvent.setup();
    render(<LayupPanel />);
    const angle = screen.getByLabelText('Ply 2 angle');
    await user.clear(angle);
    await user.type(angle, '120');
    expect(screen.getByRole('alert').textContent).toMatch(/^120 ° is out of range: allowed ≥ -90 ° and ≤ 90 °$/);
  });

  it('mirrors the tool-side half onto the bag side, keeping the ply count', async () => {
    const user = userEvent.setup();
    studyEditorStore.getState().edit('four plies', (d) => {
      d.layup.plies = [0, 45, -45, 30].map((angleDeg) => ({ angleDeg, thicknessMm: 0.2 }));
    });
    render(<LayupPanel />);
    // the whole-stack mirror says what it makes
    expect(screen.getByRole('button', { name: 'Mirror → 8 plies' })).toBeTruthy();
    await user.click(screen.getByRole('button', { name: 'Mirror the tool-side half (4 plies)' }));
    // plies 1 and 2 (0°, 45°) kept; plies 3 and 4 become their mirror (45°, 0°)
    expect(angles()).toEqual([0, 45, 45, 0]);
    expect(screen.getByTestId('layup-symmetry').textContent).toBe('symmetric');
    // symmetric already: nothing left to mirror
    expect((screen.getByRole('button', { name: 'Mirror the tool-side half (4 plies)' }) as HTMLButtonElement).disabled).toBe(true);
  });

  it('with an odd count keeps the middle ply as its own mirror', async () => {
    const user = userEvent.setup();
    render(<LayupPanel />);
    // the 3-ply stack 0/45/90: ply 2 (45°) is the middle
    await user.click(screen.getByRole('button', { name: 'Mirror the tool-side half (3 plies)' }));
    expect(angles()).toEqual([0, 45, 0]);
  });
});

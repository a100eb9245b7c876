// @vitest-environment jsdom
import { beforeEach, describe, expect, it } from 'vitest';
import { render, screen } from '@testing-library/react';
import { leeLoosSpringerResin, referenceStudy } from '../../../../../shared/solver/demo-cards';
import { studyEditorStore } from '../../stores/study-editor-store';
import { MaterialPanel } from './material-panel';

describe('material panel', () => {
  beforeEach(() => {
    const study = referenceStudy();
    study.resin = leeLoosSpringerResin();
    studyEditorStore.getState().load({ studyId: 'test', name: 'test', baseRevision: 1 }, study);
  });

  it('heads the kinetics fields with the published name of the form, not the card’s code key', () => {
    render(<MaterialPanel />);
    expect(screen.getByRole('heading', { name: 'Kinetics, Lee–Loos–Springer' })).toBeTruthy();
    expect(screen.queryByText(/lee-loos-springer/)).toBeNull();
  });
});

// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import { render, screen } from '@testing-library/react';
import { BusyIndicator } from './busy-indicator';

describe('busy indicator', () => {
  it('says "Solving…" while busy and "Results up to date" after, keeping the words in place when idle', () => {
    const { rerender } = render(<BusyIndicator busy />);
    const status = screen.getByRole('status');
    const words = screen.getByTestId('busy-words');
    expect(status.textContent).toBe('Solving…');
    expect(words.className).not.toContain('invisible');

    rerender(<BusyIndicator busy={false} />);
    // The same element, hidden but still taking its width (visibility, not display), so the toolbar does not shift.
    expect(screen.getByTestId('busy-words')).toBe(words);
    expect(words.className.split(' ')).toContain('invisible');
    // What a screen reader reads of the status: hidden words are not read.
    const read = [...status.childNodes].filter((n) => !(n instanceof HTMLElement && n.className.includes('invisible'))).map((n) => n.textContent).join('');
    expect(read).toBe('Results up to date');
  });
});

// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import { Profiler, useState } from 'react';
import { act, fireEvent, render, screen } from '@testing-library/react';
import { NumberField } from './number-field';

/** A field whose value lives outside it, as the study store's values do; `setOutside` changes it as undo or a drag would. */
function Harness({ expose, onCommit = () => undefined }: { expose: (set: (v: number) => void) => void; onCommit?: (v: number) => void }) {
  const [value, setValue] = useState(120);
  expose(setValue);
  return (
    <NumberField
      label="Dwell temperature"
      unit="°C"
      value={value}
      onCommit={(v) => {
        onCommit(v);
        setValue(v);
      }}
    />
  );
}

describe('number field', () => {
  it('follows a change made elsewhere in the same commit, with no second render and paint', () => {
    let setOutside: (v: number) => void = () => undefined;
    const commits: string[] = [];
    render(
      <Profiler id="field" onRender={(_id, phase) => commits.push(phase)}>
        <Harness expose={(s) => (setOutside = s)} />
      </Profiler>,
    );
    const input = screen.getByLabelText('Dwell temperature') as HTMLInputElement;
    expect(input.value).toBe('120');
    commits.length = 0;
    act(() => setOutside(135.5));
    expect(input.value).toBe('135.5');
    // An effect that copied the value into the text would have committed twice.
    expect(commits).toEqual(['update']);
  });

  it('keeps what is being typed while it means the value already held, and marks text that is no number', () => {
    const committed: number[] = [];
    let setOutside: (v: number) => void = () => undefined;
    render(<Harness expose={(s) => (setOutside = s)} onCommit={(v) => committed.push(v)} />);
    const input = screen.getByLabelText('Dwell temperature') as HTMLInputElement;

    fireEvent.change(input, { target: { value: '150.' } });
    expect(committed).toEqual([150]);
    expect(input.value).toBe('150.');

    fireEvent.change(input, { target: { value: '15x' } });
    expect(committed).toEqual([150]);
    expect(input.value).toBe('15x');
    expect(screen.getByRole('alert').textContent).toBe('"15x" is not a number');

    // A change from elsewhere (undo) replaces the broken text and clears its mark.
    act(() => setOutside(110));
    expect(input.value).toBe('110');
    expect(screen.queryByRole('alert')).toBeNull();
  });
});

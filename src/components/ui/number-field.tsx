import { useId, useState, type KeyboardEvent } from 'react';

export type NumberFieldProps = {
  label: string;
  /** shown after the number, always (e.g. '°C/min'); empty for dimensionless values, shown as "–" */
  unit: string;
  value: number;
  onCommit: (value: number) => void;
  /** the reason this value is not accepted (from the shared schema), shown in place */
  issue?: string;
  /** ArrowUp/ArrowDown step; Shift multiplies by 10 */
  step?: number;
  /** digits kept when the value is shown */
  digits?: number;
  /** hide the label visually (tables), keep it for assistive tech */
  compact?: boolean;
  testId?: string;
  /** why the field does not apply just now (e.g. a band for a dwell that starts on the clock); set, it is disabled */
  disabledReason?: string;
};

const format = (v: number, digits: number) => (Number.isFinite(v) ? String(Number(v.toFixed(digits))) : '');

function parse(text: string): number | null {
  const t = text.trim().replace(',', '.').replace(/^\+/, '');
  if (t === '' || !/^-?(\d+\.?\d*|\.\d+)(e-?\d+)?$/i.test(t)) return null;
  const v = Number(t);
  return Number.isFinite(v) ? v : null;
}

/**
 * A number with its unit. Every parsable keystroke is committed (the store
 * validates and the workspace refuses to solve invalid studies); text that is
 * not a number stays local and is marked here.
 */
export function NumberField({ label, unit, value, onCommit, issue, step = 1, digits = 4, compact, testId, disabledReason }: NumberFieldProps) {
  const id = useId();
  const [text, setText] = useState(() => format(value, digits));
  const [localIssue, setLocalIssue] = useState<string | null>(null);
  const [followed, setFollowed] = useState({ value, digits });

  // Follow outside changes (undo, drag) unless the text already means this value. Adjusted while rendering, not
  // in an effect: an effect would render and paint the field a second time for every step of a drag.
  if (followed.value !== value || followed.digits !== digits) {
    setFollowed({ value, digits });
    if (parse(text) !== value) {
      setText(format(value, digits));
      setLocalIssue(null);
    }
  }

  function change(next: string) {
    setText(next);
    const parsed = parse(next);
    if (parsed === null) {
      setLocalIssue(next.trim() === '' ? 'enter a number' : `"${next}" is not a number`);
      return;
    }
    setLocalIssue(null);
    if (parsed !== value) onCommit(parsed);
  }

  function onKeyDown(e: KeyboardEvent<HTMLInputElement>) {
    // Alt/Ctrl+arrows belong to the surroundings (e.g. moving a table row), not to the value.
    if ((e.key !== 'ArrowUp' && e.key !== 'ArrowDown') || e.altKey || e.ctrlKey || e.metaKey) return;
    e.preventDefault();
    const base = parse(text) ?? value;
    const delta = (e.key === 'ArrowUp' ? 1 : -1) * step * (e.shiftKey ? 10 : 1);
    change(format(base + delta, digits));
  }

  const shown = localIssue ?? issue;
  return (
    <div className={compact ? '' : 'flex flex-col gap-0.5'}>
      <label htmlFor={id} className={compact ? 'sr-only' : 'text-xs text-ink-soft'}>
        {label}
      </label>
      <div
        className={`flex items-baseline rounded border bg-paper-raised px-1.5 focus-within:outline-2 focus-within:outline-slate ${
          shown ? 'border-fault bg-fault-soft/40' : 'border-rule'
        } ${disabledReason ? 'opacity-50' : ''}`}
        title={disabledReason}
      >
        <input
          id={id}
          type="text"
          inputMode="decimal"
          autoComplete="off"
          spellCheck={false}
          className="num w-full min-w-0 bg-transparent py-0.5 text-sm outline-none"
          value={text}
          aria-invalid={shown ? true : undefined}
          aria-describedby={shown ? `${id}-issue` : disabledReason ? `${id}-why` : undefined}
          disabled={disabledReason !== undefined}
          data-testid={testId}
          onChange={(e) => change(e.target.value)}
          onKeyDown={onKeyDown}
          onBlur={() => {
            if (localIssue === null) setText(format(value, digits));
          }}
        />
        {unit ? (
          <span className="num ml-1 shrink-0 text-xs text-ink-faint">{unit}</span>
        ) : (
          <span className="num ml-1 shrink-0 text-xs text-ink-faint" title="dimensionless">
            –
          </span>
        )}
      </div>
      {disabledReason && !shown && (
        <p id={`${id}-why`} className="text-[11px] leading-snug text-ink-faint">
          {disabledReason}
        </p>
      )}
      {shown && (
        <p id={`${id}-issue`} role="alert" className="text-xs leading-snug text-fault">
          {shown}
        </p>
      )}
    </div>
  );
}

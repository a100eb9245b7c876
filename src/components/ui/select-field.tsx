import { useId } from 'react';

export type SelectOption<T extends string> = { value: T; label: string };

export function SelectField<T extends string>({
  label,
  value,
  options,
  onChange,
  issue,
  compact,
  testId,
}: {
  label: string;
  value: T;
  options: readonly SelectOption<T>[];
  onChange: (value: T) => void;
  issue?: string;
  compact?: boolean;
  testId?: string;
}) {
  const id = useId();
  return (
    <div className={compact ? '' : 'flex flex-col gap-0.5'}>
      <label htmlFor={id} className={compact ? 'sr-only' : 'text-xs text-ink-soft'}>
        {label}
      </label>
      <select
        id={id}
        value={value}
        data-testid={testId}
        aria-invalid={issue ? true : undefined}
        aria-describedby={issue ? `${id}-issue` : undefined}
        onChange={(e) => onChange(e.target.value as T)}
        className={`rounded border bg-paper-raised px-1 py-0.5 text-sm ${issue ? 'border-fault' : 'border-rule'}`}
      >
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
      {issue && (
        <p id={`${id}-issue`} role="alert" className="text-xs text-fault">
          {issue}
        </p>
      )}
    </div>
  );
}

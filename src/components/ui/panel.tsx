import type { ReactNode } from 'react';

/** A titled block of the workspace. `open` panels use <details> so they fold from the keyboard too. */
export function Panel({
  title,
  children,
  aside,
  foldable,
  defaultOpen = true,
  issueCount = 0,
  testId,
}: {
  title: string;
  children: ReactNode;
  aside?: ReactNode;
  foldable?: boolean;
  defaultOpen?: boolean;
  issueCount?: number;
  testId?: string;
}) {
  const heading = (
    <span className="flex items-center gap-2">
      <span className="text-[11px] font-semibold uppercase tracking-[0.08em] text-ink-soft">{title}</span>
      {issueCount > 0 && (
        <span className="num rounded bg-fault px-1 text-[10px] text-paper" title={`${issueCount} entries need attention`}>
          {issueCount}
        </span>
      )}
      {aside && <span className="ml-auto">{aside}</span>}
    </span>
  );
  if (foldable) {
    return (
      <details open={defaultOpen} className="group border-b border-rule" data-testid={testId}>
        <summary className="cursor-pointer select-none list-none px-3 py-2 hover:bg-rule/30">
          <span className="flex items-center gap-2">
            <span aria-hidden className="text-ink-faint transition-transform group-open:rotate-90">▸</span>
            {heading}
          </span>
        </summary>
        <div className="px-3 pb-3">{children}</div>
      </details>
    );
  }
  return (
    <section className="paint-island border-b border-rule px-3 py-2" data-testid={testId} aria-label={title}>
      <h2 className="mb-1.5">{heading}</h2>
      {children}
    </section>
  );
}

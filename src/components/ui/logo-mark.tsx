/**
 * Dwellform's mark: a cure cycle (ramp, dwell, second ramp, short dwell, cool)
 * drawn over a cure bar, inside a graphite tile.
 */
export function LogoMark({ size = 28, title = 'Dwellform' }: { size?: number; title?: string }) {
  return (
    <svg width={size} height={size} viewBox="0 0 32 32" role="img" aria-label={title}>
      <rect width="32" height="32" rx="7" fill="var(--color-ink)" />
      <path
        d="M5 24 L11 12 L20 12 L23 8 L26 8 L28 24"
        fill="none"
        stroke="var(--color-ember)"
        strokeWidth="2.6"
        strokeLinejoin="round"
        strokeLinecap="round"
      />
      <path d="M5 26.5 H28" stroke="var(--color-verdigris)" strokeWidth="2" strokeLinecap="round" />
    </svg>
  );
}

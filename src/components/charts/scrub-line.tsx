import type { ScaleLinear } from 'd3-scale';

/** The scrubbed time as a thin vertical rule through a plot (minutes on `x`); it never takes the pointer. */
export function ScrubLine({ x, minutes, height }: { x: ScaleLinear<number, number>; minutes: number; height: number }) {
  return (
    <line
      aria-hidden
      x1={x(minutes)}
      x2={x(minutes)}
      y1={0}
      y2={height}
      stroke="var(--color-ink)"
      strokeWidth={1}
      opacity={0.55}
      pointerEvents="none"
    />
  );
}

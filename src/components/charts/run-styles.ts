/**
 * How one run is told from another on a chart without relying on colour: its own dash pattern and its own
 * marker shape, repeated in the legend. Colour stays free to tell quantities apart (air, part, cure…).
 */
export type MarkerShape = 'circle' | 'triangle' | 'square';

export interface RunStyle {
  /** the letter used in legends and table headers */
  letter: string;
  /** stroke-dasharray; undefined for a solid line */
  dash: string | undefined;
  marker: MarkerShape;
  /** where along the axis the markers start, as a fraction of their spacing (so A and B do not overlap) */
  markerPhase: number;
}

export const RUN_STYLES: readonly RunStyle[] = [
  { letter: 'A', dash: undefined, marker: 'circle', markerPhase: 0.25 },
  { letter: 'B', dash: '7 4', marker: 'triangle', markerPhase: 0.75 },
  { letter: 'C', dash: '2 3', marker: 'square', markerPhase: 0.5 },
];

/** SVG path of a marker of `size` px centred on (0, 0). */
export function markerPath(shape: MarkerShape, size = 7): string {
  const r = size / 2;
  if (shape === 'circle') return `M${-r},0a${r},${r} 0 1,0 ${size},0a${r},${r} 0 1,0 ${-size},0Z`;
  if (shape === 'square') return `M${-r},${-r}h${size}v${size}h${-size}Z`;
  const h = size * 0.9;
  return `M0,${-h / 2 - 0.5}L${r},${h / 2}L${-r},${h / 2}Z`;
}

/** Indices of evenly spaced marker positions along increasing `xs`, about one every `spacing` of x. */
export function markerIndices(xs: ArrayLike<number>, spacing: number, phase: number): number[] {
  const n = xs.length;
  if (n === 0 || !(spacing > 0)) return [];
  const out: number[] = [];
  let target = xs[0] + spacing * phase;
  let i = 0;
  while (target <= xs[n - 1]) {
    while (i < n - 1 && xs[i + 1] <= target) i++;
    if (out[out.length - 1] !== i) out.push(i);
    target += spacing;
  }
  return out;
}

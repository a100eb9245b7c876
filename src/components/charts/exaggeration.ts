/**
 * How much to exaggerate the shape after demould so it can be seen: a bow of
 * about 25 px over the strip and a corner closing by about 25°, whichever needs
 * less, rounded down to 1, 2 or 5 times a power of ten, within 1–1000.
 */
export const EXAGGERATION_RANGE = [1, 1000] as const;

export function niceFactorBelow(x: number): number {
  if (!(x > 1)) return 1;
  const decade = 10 ** Math.floor(Math.log10(x));
  const lead = x / decade;
  return (lead >= 5 ? 5 : lead >= 2 ? 2 : 1) * decade;
}

export function defaultExaggeration(warpageMm: number, springInDeg: number, pxPerMm: number): number {
  const byWarp = Math.abs(warpageMm) > 0 ? 25 / (Math.abs(warpageMm) * pxPerMm) : Infinity;
  const bySpring = Math.abs(springInDeg) > 0 ? 25 / Math.abs(springInDeg) : Infinity;
  if (!Number.isFinite(byWarp) && !Number.isFinite(bySpring)) return EXAGGERATION_RANGE[0];
  return niceFactorBelow(Math.min(byWarp, bySpring, EXAGGERATION_RANGE[1]));
}

// Aligns two lists (plies, cycle segments) so an inserted item reads as one "added", not as every later item
// "changed", and an edited item is matched with the item it most resembles. This is the weighted form of the
// longest-common-subsequence programme (Needleman & Wunsch, J. Mol. Biol. 48, 1970; Cormen et al.,
// Introduction to Algorithms, §15.4): pairing x with y scores `similarity(x, y)` (0 = may not pair), and the
// alignment maximises the total. Between two paired items, leftovers pair up in order as "changed" (a
// segment of another kind at the same place reads as replaced); the surplus is "added" or "removed".

export type AlignedPair<T> =
  | { kind: 'same'; a: T; b: T; indexA: number; indexB: number }
  | { kind: 'changed'; a: T; b: T; indexA: number; indexB: number }
  | { kind: 'removed'; a: T; indexA: number }
  | { kind: 'added'; b: T; indexB: number };

/**
 * Similarity of two plain objects for alignment: 0 when their `kind` differs (they may not pair), else
 * 1 + the fraction of fields that are equal, so an identical item (2) always beats a near one.
 */
export function fieldSimilarity(x: object, y: object): number {
  const rx = x as Record<string, unknown>;
  const ry = y as Record<string, unknown>;
  if (rx.kind !== ry.kind) return 0;
  const keys = [...new Set([...Object.keys(rx), ...Object.keys(ry)])].filter((k) => k !== 'kind');
  if (keys.length === 0) return 2;
  return 1 + keys.filter((k) => deepEqual(rx[k], ry[k])).length / keys.length;
}

export function alignLists<T extends object>(
  a: readonly T[],
  b: readonly T[],
  similarity: (x: T, y: T) => number = fieldSimilarity,
): AlignedPair<T>[] {
  const n = a.length;
  const m = b.length;
  const width = m + 1;
  // best[i][j]: highest total similarity aligning a[i..] with b[j..]; flat (n+1)×(m+1).
  const best = new Float64Array((n + 1) * width);
  const sim = new Float64Array(n * m);
  for (let i = n - 1; i >= 0; i--) {
    for (let j = m - 1; j >= 0; j--) {
      const s = similarity(a[i], b[j]);
      sim[i * m + j] = s;
      const skip = Math.max(best[(i + 1) * width + j], best[i * width + j + 1]);
      best[i * width + j] = s > 0 ? Math.max(skip, s + best[(i + 1) * width + j + 1]) : skip;
    }
  }

  const out: AlignedPair<T>[] = [];
  let gapA: number[] = [];
  let gapB: number[] = [];
  const flushGap = () => {
    const paired = Math.min(gapA.length, gapB.length);
    for (let k = 0; k < paired; k++) out.push({ kind: 'changed', a: a[gapA[k]], b: b[gapB[k]], indexA: gapA[k], indexB: gapB[k] });
    for (let k = paired; k < gapA.length; k++) out.push({ kind: 'removed', a: a[gapA[k]], indexA: gapA[k] });
    for (let k = paired; k < gapB.length; k++) out.push({ kind: 'added', b: b[gapB[k]], indexB: gapB[k] });
    gapA = [];
    gapB = [];
  };

  const EPS = 1e-9;
  let i = 0;
  let j = 0;
  while (i < n && j < m) {
    const s = sim[i * m + j];
    if (s > 0 && Math.abs(best[i * width + j] - (s + best[(i + 1) * width + j + 1])) < EPS) {
      flushGap();
      const kind = deepEqual(a[i], b[j]) ? 'same' : 'changed';
      out.push({ kind, a: a[i], b: b[j], indexA: i, indexB: j });
      i++;
      j++;
    } else if (best[(i + 1) * width + j] >= best[i * width + j + 1]) {
      gapA.push(i++);
    } else {
      gapB.push(j++);
    }
  }
  while (i < n) gapA.push(i++);
  while (j < m) gapB.push(j++);
  flushGap();
  return out;
}

/** Structural equality of JSON-like values (study params are plain JSON). */
export function deepEqual(x: unknown, y: unknown): boolean {
  if (x === y) return true;
  if (typeof x !== 'object' || typeof y !== 'object' || x === null || y === null) return false;
  if (Array.isArray(x) !== Array.isArray(y)) return false;
  if (Array.isArray(x) && Array.isArray(y)) return x.length === y.length && x.every((v, k) => deepEqual(v, y[k]));
  const kx = Object.keys(x).filter((k) => (x as Record<string, unknown>)[k] !== undefined);
  const ky = Object.keys(y).filter((k) => (y as Record<string, unknown>)[k] !== undefined);
  if (kx.length !== ky.length) return false;
  return kx.every((k) => deepEqual((x as Record<string, unknown>)[k], (y as Record<string, unknown>)[k]));
}

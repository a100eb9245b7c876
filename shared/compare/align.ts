// Aligns two lists (plies, cycle segments) so an inserted item reads as one "added", not as every later item
// "changed". Longest common subsequence on exact equality (the textbook dynamic programme, e.g. Cormen et al.,
// Introduction to Algorithms, §15.4); between two matched anchors, leftover items pair up in order as
// "changed" and the surplus on either side is "added" or "removed".

export type AlignedPair<T> =
  | { kind: 'same'; a: T; b: T; indexA: number; indexB: number }
  | { kind: 'changed'; a: T; b: T; indexA: number; indexB: number }
  | { kind: 'removed'; a: T; indexA: number }
  | { kind: 'added'; b: T; indexB: number };

export function alignLists<T>(a: readonly T[], b: readonly T[], equal: (x: T, y: T) => boolean): AlignedPair<T>[] {
  const n = a.length;
  const m = b.length;
  // lcs[i][j] = LCS length of a[i..] and b[j..]; flat array, (n+1)×(m+1).
  const width = m + 1;
  const lcs = new Int32Array((n + 1) * width);
  for (let i = n - 1; i >= 0; i--) {
    for (let j = m - 1; j >= 0; j--) {
      lcs[i * width + j] = equal(a[i], b[j])
        ? lcs[(i + 1) * width + j + 1] + 1
        : Math.max(lcs[(i + 1) * width + j], lcs[i * width + j + 1]);
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

  let i = 0;
  let j = 0;
  while (i < n && j < m) {
    if (equal(a[i], b[j]) && lcs[i * width + j] === lcs[(i + 1) * width + j + 1] + 1) {
      flushGap();
      out.push({ kind: 'same', a: a[i], b: b[j], indexA: i, indexB: j });
      i++;
      j++;
    } else if (lcs[(i + 1) * width + j] >= lcs[i * width + j + 1]) {
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

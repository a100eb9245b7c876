/**
 * Rows for labels laid along one axis so that none overlaps another: each label, taken left to right, goes into
 * the first row whose last label ends at least `gap` px before it starts. Widths are estimates (the text is
 * not measured: the charts render the same in tests, on screen and in an exported file).
 */
export function labelRows(spans: readonly { x: number; width: number }[], gap = 4): number[] {
  const order = spans.map((_, i) => i).sort((a, b) => spans[a].x - spans[b].x);
  const rowEnds: number[] = [];
  const rows = new Array<number>(spans.length);
  for (const i of order) {
    const { x, width } = spans[i];
    let row = rowEnds.findIndex((end) => end + gap <= x);
    if (row === -1) row = rowEnds.length;
    rowEnds[row] = x + width;
    rows[i] = row;
  }
  return rows;
}

/** About how wide a line of chart text is: 0.58 em per character, a fair average for the app's sans. */
export function textWidthPx(text: string, fontSizePx: number): number {
  return text.length * fontSizePx * 0.58;
}

// Where each visit's label goes on a night chart: beside its segment, clear of the others.

/** A label to place: its anchor (the middle of its segment) in chart pixels and its text. */
export interface LabelAnchor {
  xPx: number;
  yPx: number;
  text: string;
}

/** A placed label: its centre in chart pixels and its box size. */
export interface PlacedLabel {
  xPx: number;
  yPx: number;
  widthPx: number;
  heightPx: number;
}

/** Vertical offsets tried in turn (px; negative is above the segment): nearest first. */
const OFFSETS_PX = [-11, 12, -23, 24, -35, 36, -47, 48, -59, 60];

const overlapPx2 = (a: PlacedLabel, b: PlacedLabel) =>
  Math.max(0, Math.min(a.xPx + a.widthPx / 2, b.xPx + b.widthPx / 2) - Math.max(a.xPx - a.widthPx / 2, b.xPx - b.widthPx / 2)) *
  Math.max(0, Math.min(a.yPx + a.heightPx / 2, b.yPx + b.heightPx / 2) - Math.max(a.yPx - a.heightPx / 2, b.yPx - b.heightPx / 2));

/**
 * Greedy placement in the anchors' order: each label takes the nearest offset above or below its
 * anchor whose box stays inside the chart and overlaps no label placed before; when none does,
 * the offset with the least overlap. Widths are estimated from the text length (`charPx` a
 * character), so the boxes are approximate.
 */
export function placeLabels(anchors: LabelAnchor[], charPx: number, lineHeightPx: number, widthPx: number, heightPx: number): PlacedLabel[] {
  const placed: PlacedLabel[] = [];
  for (const a of anchors) {
    const w = a.text.length * charPx + 4;
    const x = Math.min(widthPx - w / 2, Math.max(w / 2, a.xPx));
    const candidates = OFFSETS_PX.map((dy) => ({ xPx: x, yPx: a.yPx + dy, widthPx: w, heightPx: lineHeightPx })).filter(
      (c) => c.yPx - lineHeightPx / 2 >= 0 && c.yPx + lineHeightPx / 2 <= heightPx,
    );
    const cost = (c: PlacedLabel) => placed.reduce((sum, p) => sum + overlapPx2(c, p), 0);
    const free = candidates.find((c) => cost(c) === 0);
    const best = free ?? candidates.reduce((b, c) => (cost(c) < cost(b) ? c : b), candidates[0] ?? { xPx: x, yPx: a.yPx, widthPx: w, heightPx: lineHeightPx });
    placed.push(best);
  }
  return placed;
}

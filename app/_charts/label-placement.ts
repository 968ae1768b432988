/**
 * Places point labels of a chart so that they overlap neither each other nor any point marker and
 * stay inside the area given (the plot area, so never over the axes' ticks). Greedy: points in the
 * given order, each label at the first free spot on rings of growing distance around its point, in
 * eight directions; a label placed away from its point gets a leader line.
 */

export interface LabelBox {
  x: number;
  y: number;
  width: number;
  height: number;
}

export interface PointToLabel {
  x: number;
  y: number;
  text: string;
}

export interface PlacedLabel {
  text: string;
  /** Left and baseline of the text. */
  x: number;
  y: number;
  box: LabelBox;
  /** True when the label sits away from its point (draw a leader line from the point to `anchor`). */
  leader: boolean;
  anchor: { x: number; y: number };
}

export interface PlacementOptions {
  /** Width of one character of the label font, px (a generous estimate for 11 px sans-serif). */
  charWidth?: number;
  /** Height of the label's box, px. */
  lineHeight?: number;
  /** Half-size of a point marker, px. */
  markerRadius?: number;
  /** Largest distance from the point, px. */
  maxDistance?: number;
}

const DIRECTIONS: readonly [number, number][] = [
  [1, -1],
  [1, 1],
  [-1, -1],
  [-1, 1],
  [0, -1],
  [0, 1],
  [1, 0],
  [-1, 0],
];

function intersects(a: LabelBox, b: LabelBox): boolean {
  return a.x < b.x + b.width && b.x < a.x + a.width && a.y < b.y + b.height && b.y < a.y + a.height;
}

function inside(a: LabelBox, area: LabelBox): boolean {
  return a.x >= area.x && a.y >= area.y && a.x + a.width <= area.x + area.width && a.y + a.height <= area.y + area.height;
}

/**
 * A box for the label at direction (dx, dy) and gap `d` from the point: to the right/left the text
 * starts/ends `d` beyond the marker; above/below its box clears the marker by `d`.
 */
function boxAt(p: PointToLabel, width: number, height: number, r: number, dx: number, dy: number, d: number): LabelBox {
  const x = dx > 0 ? p.x + r + d : dx < 0 ? p.x - r - d - width : p.x - width / 2;
  const y = dy < 0 ? p.y - r - d - height : dy > 0 ? p.y + r + d : p.y - height / 2;
  return { x, y, width, height };
}

/** Labels placed free of each other and of every marker, inside `area`; a label with no free spot within reach is left out (null). */
export function placeLabels(points: readonly PointToLabel[], area: LabelBox, options: PlacementOptions = {}): (PlacedLabel | null)[] {
  const charWidth = options.charWidth ?? 6.6;
  const height = options.lineHeight ?? 13;
  const r = options.markerRadius ?? 7;
  const maxDistance = options.maxDistance ?? 90;
  const taken: LabelBox[] = points.map((p) => ({ x: p.x - r, y: p.y - r, width: 2 * r, height: 2 * r }));
  return points.map((p) => {
    const width = Math.ceil(p.text.length * charWidth) + 2;
    for (let d = 1; d <= maxDistance; d += d < 8 ? 3 : 6) {
      for (const [dx, dy] of DIRECTIONS) {
        const box = boxAt(p, width, height, r, dx, dy, d);
        if (!inside(box, area) || taken.some((t) => intersects(t, box))) continue;
        taken.push(box);
        const leader = d > 8;
        const anchor = { x: Math.min(Math.max(p.x, box.x), box.x + box.width), y: Math.min(Math.max(p.y, box.y), box.y + box.height) };
        return { text: p.text, x: box.x + 1, y: box.y + height - 3, box, leader, anchor };
      }
    }
    return null;
  });
}

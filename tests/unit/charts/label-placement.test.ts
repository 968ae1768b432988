import { describe, expect, it } from "vitest";
import { placeLabels, type LabelBox } from "../../../app/_charts/label-placement";

const hit = (a: LabelBox, b: LabelBox) => a.x < b.x + b.width && b.x < a.x + a.width && a.y < b.y + b.height && b.y < a.y + a.height;

describe("chart label placement", () => {
  it("labels of crowded points overlap neither each other nor any marker and stay inside the area", () => {
    const area = { x: 50, y: 20, width: 500, height: 260 };
    // Five points within a few pixels of each other (hydrogen blends of nearly equal cost and CO2) and one apart.
    const points = [0, 1, 2, 3, 4]
      .map((i) => ({ x: 300 + 3 * i, y: 150 + 2 * i, text: `${10 * i} % hydrogen blend` }))
      .concat([{ x: 90, y: 250, text: "Biomethane" }]);
    const placed = placeLabels(points, area);
    expect(placed.every((p) => p !== null)).toBe(true);
    const boxes = placed.map((p) => p!.box);
    const markers = points.map((p) => ({ x: p.x - 7, y: p.y - 7, width: 14, height: 14 }));
    for (let i = 0; i < boxes.length; i++) {
      const b = boxes[i];
      expect(b.x >= area.x && b.y >= area.y && b.x + b.width <= area.x + area.width && b.y + b.height <= area.y + area.height).toBe(true);
      for (let j = i + 1; j < boxes.length; j++) expect(hit(b, boxes[j]), `${i} ${j}`).toBe(false);
      for (const m of markers) expect(hit(b, m)).toBe(false);
    }
    // The lone point keeps its label right beside it, without a leader line.
    expect(placed[5]!.leader).toBe(false);
  });

  it("leaves out a label that has no free place within reach", () => {
    const placed = placeLabels([{ x: 10, y: 10, text: "a long name that cannot fit" }], { x: 0, y: 0, width: 20, height: 20 });
    expect(placed).toEqual([null]);
  });
});

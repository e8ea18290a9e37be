import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { estimateTextWidth, placeLabel } from "./label-placement";

describe("placeLabel", () => {
  it("placeLabel keeps a label inside the area whenever it fits on one side of its node", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 400, noNaN: true }),
        fc.double({ min: 2, max: 20, noNaN: true }),
        fc.double({ min: 1, max: 300, noNaN: true }),
        (x, r, w) => {
          const left = 0;
          const right = 400;
          const fitsSomewhere = x + r + 4 + w <= right || x - r - 4 - w >= left;
          const placed = placeLabel(x, r, w, left, right);
          const [from, to] = placed.anchor === "start" ? [placed.x, placed.x + w] : [placed.x - w, placed.x];
          if (fitsSomewhere) {
            expect(from).toBeGreaterThanOrEqual(left - 1e-9);
            expect(to).toBeLessThanOrEqual(right + 1e-9);
          }
        },
      ),
      { seed: 3, numRuns: 500 },
    );
  });

  it("placeLabel moves a long name near the right edge to the node's left, as for Kin_Phosphatase", () => {
    const width = estimateTextWidth("Kin_Phosphatase");
    expect(placeLabel(380, 8, width, 0, 400).anchor).toBe("end");
    expect(placeLabel(20, 8, width, 0, 400).anchor).toBe("start");
  });

  it("estimateTextWidth grows with the text and counts wide letters wider", () => {
    expect(estimateTextWidth("mm")).toBeGreaterThan(estimateTextWidth("ii"));
    expect(estimateTextWidth("Tk1a → Tk1")).toBeGreaterThan(estimateTextWidth("Tk1a"));
  });
});

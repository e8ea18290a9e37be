import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { screenUnits } from "@shared/engine/screens";
import type { ScreenRunRow } from "@shared/schemas/screens";
import { cellColour, intensity, measureOf, screenHeatmap, type HeatmapMeasure } from "./screen-heatmap";

const names = (n: number) => Array.from({ length: n }, (_, i) => `n${i}`);

function row(unit: number, perturbation: Record<string, 0 | 1>, share: number | null, before: number): ScreenRunRow {
  return {
    unit,
    perturbation,
    basinShare: share,
    basinShareChange: share === null ? null : share - 0.5,
    attractorsBefore: 3,
    attractorsAfter: 2,
    phenotypeAttractorsBefore: before,
    phenotypeAttractorsAfter: unit % 3,
    attractorsLost: 1,
    attractorsGained: 0,
    phenotypeFixedPoints: null,
    complete: true,
    trapSpaces: null,
  };
}

/** Plain lookup: the row whose perturbation holds exactly these nodes at these values. */
function slowFind(rows: readonly ScreenRunRow[], p: Record<string, 0 | 1>): ScreenRunRow | null {
  return (
    rows.find(
      (r) =>
        Object.keys(r.perturbation).length === Object.keys(p).length &&
        Object.entries(p).every(([n, v]) => r.perturbation[n] === v),
    ) ?? null
  );
}

const screenArb = fc
  .record({
    m: fc.integer({ min: 1, max: 6 }),
    pairs: fc.boolean(),
    measure: fc.constantFrom<HeatmapMeasure>("share", "change", "phenotype-attractors"),
    sat: fc.boolean(),
    seed: fc.integer({ min: 0, max: 1000 }),
  })
  .chain((c) => {
    const units = screenUnits({ nodes: names(c.m), pairs: c.pairs, phenotype: { n0: 1 } });
    return fc.record({
      c: fc.constant(c),
      // Some rows may be missing (a cell then says "not screened"), and the list arrives in any order.
      rows: fc
        .tuple(
          fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: units.length, maxLength: units.length }),
          fc.subarray(units.map((u) => u.index)),
        )
        .map(([shares, kept]) =>
          kept.map((i) =>
            row(
              i,
              // Written in reverse node order: the layout must not depend on how a perturbation lists its nodes.
              Object.fromEntries(Object.entries(units[i]!.perturbation).reverse()),
              c.sat ? null : shares[i]!,
              c.seed % 4,
            ),
          ),
        )
        .chain((rows) => fc.shuffledSubarray(rows, { minLength: rows.length, maxLength: rows.length })),
    });
  });

describe("screenHeatmap", () => {
  it("screenHeatmap puts each screened perturbation in its cell, as a plain lookup of the rows finds it", () => {
    fc.assert(
      fc.property(screenArb, ({ c, rows }) => {
        const map = screenHeatmap({ rows }, c.measure);
        const withPairs = rows.some((r) => Object.keys(r.perturbation).length === 2);
        expect(map.layout).toBe(withPairs ? "pairs" : "singles");
        expect(map.cells).toHaveLength(map.rows.length);
        map.cells.forEach((line, i) =>
          line.forEach((cell, j) => {
            const a = map.rows[i]!;
            const b = map.columns[j]!;
            const p: Record<string, 0 | 1> | null =
              map.layout === "singles"
                ? { [a.node]: b.value! }
                : a.node !== b.node
                  ? { [a.node]: a.value!, [b.node]: b.value! }
                  : a.value === b.value
                    ? { [a.node]: a.value! }
                    : null;
            if (p === null) return expect(cell.status).toBe("impossible");
            const found = slowFind(rows, p);
            expect(cell.row).toBe(found);
            if (!found) return expect(cell.status).toBe("missing");
            expect(cell.value).toBe(measureOf(found, c.measure));
            expect(cell.status).toBe(cell.value === null ? "undecided" : "value");
          }),
        );
        // Every row is shown: singles once each, a pair twice (the matrix is symmetric).
        const seen = new Map<ScreenRunRow, number>();
        for (const cell of map.cells.flat()) if (cell.row) seen.set(cell.row, (seen.get(cell.row) ?? 0) + 1);
        for (const r of rows) {
          const times = map.layout === "pairs" && Object.keys(r.perturbation).length === 2 ? 2 : 1;
          expect(seen.get(r)).toBe(times);
        }
        if (map.layout === "pairs")
          map.cells.forEach((line, i) => line.forEach((cell, j) => expect(map.cells[j]![i]!.row).toBe(cell.row)));
        // The scale spans every value shown, and change scales are centred on 0.
        for (const cell of map.cells.flat())
          if (cell.value !== null) {
            expect(cell.value).toBeGreaterThanOrEqual(map.domain[0]);
            expect(cell.value).toBeLessThanOrEqual(map.domain[1]);
          }
        if (c.measure !== "share") expect(map.domain[0]).toBe(-map.domain[1]);
      }),
      { seed: 42, numRuns: 300 },
    );
  });

  it("screenHeatmap of single perturbations has a row per node in screen order and knock-out, over-expression columns", () => {
    const rows = screenUnits({ nodes: ["Gb", "Ga"], pairs: false, phenotype: { Ga: 1 } }).map((u) =>
      row(u.index, u.perturbation, u.index / 4, 0),
    );
    const map = screenHeatmap({ rows }, "share");
    expect(map.rows.map((r) => r.label)).toEqual(["Gb", "Ga"]);
    expect(map.columns.map((c) => c.label)).toEqual(["knock-out", "over-expression"]);
    expect(map.cells.map((line) => line.map((c) => c.value))).toEqual([
      [0, 0.25],
      [0.5, 0.75],
    ]);
  });

  it("intensity grows with the value on the share scale and with its size on a change scale, red below zero", () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), (x, y) => {
        const [lo, hi] = x <= y ? [x, y] : [y, x];
        expect(intensity(lo, [0, 1]).t).toBeLessThanOrEqual(intensity(hi, [0, 1]).t);
        expect(intensity(-lo, [-1, 1])).toEqual({ t: lo, negative: lo > 0 });
        expect(intensity(hi, [-1, 1])).toEqual({ t: hi, negative: false });
      }),
      { seed: 3 },
    );
    expect(cellColour(0, [0, 1])).toEqual({ background: "rgb(248, 250, 252)", dark: false });
    expect(cellColour(1, [0, 1])).toEqual({ background: "rgb(17, 94, 89)", dark: true });
    expect(cellColour(-2, [-2, 2])).toEqual({ background: "rgb(185, 28, 28)", dark: true });
  });
});

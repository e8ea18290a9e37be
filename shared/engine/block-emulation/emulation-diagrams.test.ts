import { describe, expect, it } from "vitest";
import { ecaRule, cellsFromString } from "../automata";
import { emulationDiagrams, encodeConfiguration, blockEmulations } from "./index";

describe("emulationDiagrams", () => {
  it("emulationDiagrams gives F rows, sampled every t steps, that decode to G's rows for every witness of rule 1 at k = 4", () => {
    const initial = cellsFromString("0110100111010001");
    const found = blockEmulations(ecaRule(1), 4).emulations;
    expect(found.length).toBeGreaterThan(0);
    for (const e of found) {
      const d = emulationDiagrams(ecaRule(1), e.target, e, initial, 10);
      expect(d.emulator.steps).toBe(10);
      for (let s = 0; s <= 10; s++) {
        const row = d.emulator.cells.subarray(s * d.emulator.width, (s + 1) * d.emulator.width);
        const expected = encodeConfiguration(d.target.cells.subarray(s * 16, (s + 1) * 16), e.u0, e.u1);
        expect([...row]).toEqual([...expected]);
      }
    }
  });

  it("encodeConfiguration replaces each cell by its codeword", () => {
    expect([...encodeConfiguration(cellsFromString("101"), "00", "10")]).toEqual([1, 0, 0, 0, 1, 0]);
  });
});

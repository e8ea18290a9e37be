import { describe, expect, it } from "vitest";
import seedrandom from "seedrandom";
import { nkNetwork } from "./nk-network";

describe("nkNetwork", () => {
  it("nkNetwork gives every node exactly K distinct regulators and a table of 2^K rows", () => {
    const random = seedrandom("4501");
    for (const [n, k] of [
      [1, 0],
      [1, 1],
      [5, 5],
      [12, 2],
      [30, 4],
    ] as const) {
      const net = nkNetwork({ n, k, random });
      expect(net.names).toHaveLength(n);
      for (let i = 0; i < n; i++) {
        const regs = Array.from(net.regulators[i]!);
        expect(new Set(regs).size).toBe(k);
        expect(regs.every((r) => r >= 0 && r < n)).toBe(true);
        expect(net.tables[i]!.length).toBe(1 << k);
      }
    }
  });

  it("nkNetwork sets table entries to 1 with probability p over many draws", () => {
    const random = seedrandom("4502");
    for (const p of [0.1, 0.3, 0.5, 0.85]) {
      let ones = 0;
      let total = 0;
      for (let draw = 0; draw < 40; draw++) {
        const net = nkNetwork({ n: 25, k: 3, p, random });
        for (const t of net.tables) for (const v of t) ((ones += v), total++);
      }
      const sd = Math.sqrt(total * p * (1 - p));
      expect(Math.abs(ones - p * total)).toBeLessThan(5 * sd);
    }
  });

  it("nkNetwork draws each node as a regulator about K/N of the time, itself included", () => {
    const random = seedrandom("4503");
    const n = 10;
    const k = 3;
    const counts = new Array<number>(n).fill(0);
    let self = 0;
    const draws = 400;
    for (let d = 0; d < draws; d++) {
      const net = nkNetwork({ n, k, random });
      net.regulators.forEach((regs, i) => regs.forEach((r) => (counts[r]!++, r === i && self++)));
    }
    const expected = (draws * n * k) / n;
    for (const c of counts) expect(Math.abs(c - expected)).toBeLessThan(5 * Math.sqrt(expected));
    expect(Math.abs(self - draws * k)).toBeLessThan(5 * Math.sqrt(draws * k));
  });

  it("nkNetwork gives the same network for the same seed", () => {
    const a = nkNetwork({ n: 8, k: 2, p: 0.4, random: seedrandom("x") });
    const b = nkNetwork({ n: 8, k: 2, p: 0.4, random: seedrandom("x") });
    expect(b).toEqual(a);
  });

  it("nkNetwork rejects K larger than N and p outside [0, 1]", () => {
    expect(() => nkNetwork({ n: 3, k: 4, random: Math.random })).toThrow(/K must be/);
    expect(() => nkNetwork({ n: 3, k: 1, p: 1.5, random: Math.random })).toThrow(/p must lie/);
  });
});

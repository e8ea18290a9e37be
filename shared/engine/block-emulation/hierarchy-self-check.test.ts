import { describe, expect, it } from "vitest";
import { reflectEca } from "../automata";
import { ecaHierarchy } from "./eca-hierarchy";
import { checkHierarchyAgainstSmaller } from "./hierarchy-self-check";

const big = ecaHierarchy(6);
const small = ecaHierarchy(4);

describe("checkHierarchyAgainstSmaller", () => {
  it("passes the engine's hierarchy to K = 6 against its hierarchy to K = 4, with new pairs to replay", () => {
    const check = checkHierarchyAgainstSmaller(big, small);
    expect(check.ok).toBe(true);
    expect(check.newPairs).toBeGreaterThan(0);
    expect(check.newPairs).toBe(big.relations.filter((r) => r.minBlock > 4).length);
  });

  it("reports a relation lost on the way up, a witness the simulator rejects and a broken symmetry", () => {
    const dropped = small.relations.find((r) => r.minBlock === 3)!;
    const fresh = big.relations.find((r) => r.minBlock === 6)!;
    const tampered = {
      ...big,
      relations: big.relations
        .filter((r) => !(r.source === dropped.source && r.target === dropped.target))
        .map((r) => (r === fresh ? { ...r, u1: r.u0 } : r)),
    };
    const check = checkHierarchyAgainstSmaller(tampered, small);
    expect(check.ok).toBe(false);
    expect(check.lost).toEqual([dropped]);
    expect(check.newPairsRejected.map((r) => [r.source, r.target])).toEqual([[fresh.source, fresh.target]]);
    // the dropped pair's symmetric images now point at a missing relation
    expect(check.symmetryBreaks.length).toBeGreaterThan(0);
  });

  it("reports a mutual class whose mirror or complement image is not a class", () => {
    // split one member off a class whose images are other classes, so the images no longer match
    const i = big.mutualClasses.findIndex(
      (c) => c.length >= 2 && c.every((f) => reflectEca(f) !== f && !c.includes(reflectEca(f))),
    );
    expect(i).toBeGreaterThanOrEqual(0);
    const classes = big.mutualClasses.map((c) => [...c]);
    classes.push([classes[i]!.pop()!]);
    const check = checkHierarchyAgainstSmaller({ ...big, mutualClasses: classes }, small);
    expect(check.classBreaks.length).toBeGreaterThan(0);
    expect(check.ok).toBe(false);
  });
});

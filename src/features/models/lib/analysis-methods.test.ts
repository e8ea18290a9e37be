import { describe, expect, it } from "vitest";
import { EXACT_ASYNCHRONOUS_MAX_NODES, EXACT_SYNCHRONOUS_MAX_NODES, nextStepFor } from "./analysis-methods";

describe("nextStepFor", () => {
  it("nextStepFor(n) offers exact analysis up to the engine's limits and SAT with trap spaces beyond them", () => {
    expect(nextStepFor(EXACT_ASYNCHRONOUS_MAX_NODES).methods).toEqual(["exact-synchronous", "async-attractors"]);
    expect(nextStepFor(EXACT_SYNCHRONOUS_MAX_NODES).methods).toEqual(["exact-synchronous", "trap-spaces"]);
    expect(nextStepFor(EXACT_SYNCHRONOUS_MAX_NODES + 1).methods).toEqual(["sat-cycles", "trap-spaces"]);
    expect(nextStepFor(40).reason).toContain("40 nodes");
  });
});

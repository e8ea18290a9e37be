import { describe, expect, it } from "vitest";
import { plural } from "./plural";

describe("plural", () => {
  it("uses the singular for exactly one and the plural otherwise (common practice in English)", () => {
    expect(plural(1, "node")).toBe("1 node");
    expect(plural(0, "node")).toBe("0 nodes");
    expect(plural(2, "step")).toBe("2 steps");
    expect(plural(1, "finding is", "findings are")).toBe("1 finding is");
    expect(plural(1200, "state")).toBe("1,200 states");
  });
});

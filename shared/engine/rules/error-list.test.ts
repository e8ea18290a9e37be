import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { ErrorList, firstErrorCounting } from "./error-list";

describe("ErrorList", () => {
  it("ErrorList keeps the first errors by position, in a stable order, and counts the rest, as sorting all of them does", () => {
    const position = fc.record({ line: fc.integer({ min: 1, max: 30 }), column: fc.integer({ min: 1, max: 5 }) });
    fc.assert(
      fc.property(fc.array(position, { maxLength: 300 }), fc.integer({ min: 1, max: 40 }), (added, limit) => {
        const list = new ErrorList(limit);
        added.forEach((p, i) => list.add(p.line, p.column, `error ${i}`));
        // Reference: all of them, sorted stably by line then column, cut at the limit.
        const all = added.map((p, i) => ({ ...p, reason: `error ${i}` }));
        all.sort((a, b) => a.line - b.line || a.column - b.column);
        expect(list.errors.map((e) => [e.line, e.column, e.reason])).toEqual(
          all.slice(0, limit).map((e) => [e.line, e.column, e.reason]),
        );
        expect(list.moreErrors).toBe(Math.max(0, added.length - limit));
        expect(list.count).toBe(added.length);
      }),
      { seed: 5201, numRuns: 400 },
    );
  });

  it("ErrorList builds a message only for an error it keeps", () => {
    const list = new ErrorList(1);
    let built = 0;
    list.add(1, 1, "kept");
    list.add(2, 1, () => `dropped ${++built}`);
    expect([list.errors.length, list.moreErrors, built]).toEqual([1, 1, 0]);
  });

  it("firstErrorCounting names how many errors there were besides the first", () => {
    const list = new ErrorList(2);
    for (let line = 1; line <= 5; line++) list.add(line, 3, `fault ${line}`, "PARSE_ERROR");
    const first = firstErrorCounting(list.errors, list.moreErrors);
    expect([first.reason, first.line, first.column]).toEqual(["fault 1 (and 4 more errors)", 1, 3]);
    expect(firstErrorCounting(list.errors.slice(0, 1), 0)).toBe(list.errors[0]);
  });
});

import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { mentionsIn } from "./notify-people";

const people = [
  { userId: "a", displayName: "Ada" },
  { userId: "ab", displayName: "Ada Byron" },
  { userId: "r", displayName: "Rui Okafor" },
];

describe("mentionsIn", () => {
  it("finds members named after @, case-insensitive, the longest name first", () => {
    expect(mentionsIn("Thanks @ada byron, and @RUI OKAFOR please check", people).sort()).toEqual(["ab", "r"]);
    expect(mentionsIn("@Ada: see above", people)).toEqual(["a"]);
  });

  it("ignores a name that runs on into a longer word, and text without @", () => {
    expect(mentionsIn("@Adamant is not a person", people)).toEqual([]);
    expect(mentionsIn("Ada Byron wrote this", people)).toEqual([]);
  });

  it("agrees with a plain reference: a member is mentioned iff @name appears followed by a non-letter", () => {
    fc.assert(
      fc.property(
        fc.array(fc.constantFrom("@Ada ", "@Rui Okafor.", "hello ", "@Ruin ", "@"), { maxLength: 8 }),
        (parts) => {
          const text = parts.join("");
          const expected = new Set<string>();
          for (const p of people) {
            const re = new RegExp(`@${p.displayName}(?![\\p{L}\\p{N}])`, "giu");
            if (re.test(text)) expected.add(p.userId);
          }
          // "@Ada Byron" also contains "@Ada " followed by a space; the longest-match rule takes Ada Byron only then.
          if (/@ada byron(?![\p{L}\p{N}])/iu.test(text) && !/@ada(?! byron)(?![\p{L}\p{N}])/iu.test(text))
            expected.delete("a");
          expect(new Set(mentionsIn(text, people))).toEqual(expected);
        },
      ),
      { seed: 14, numRuns: 300 },
    );
  });
});

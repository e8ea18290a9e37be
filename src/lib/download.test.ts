import { describe, expect, it } from "vitest";
import { csvText, fileNameOf } from "./download";

describe("csvText", () => {
  // RFC 4180 (Shafranovich, "Common Format and MIME Type for CSV Files", IETF 2005): quotes around a field holding a
  // comma, quote or line break; a quote inside is doubled; lines end with CRLF.
  it("quotes fields as RFC 4180 asks", () => {
    expect(
      csvText([
        ["a", 'say "hi"', "x,y"],
        [1, null, "two\nlines"],
      ]),
    ).toBe('a,"say ""hi""","x,y"\r\n1,,"two\nlines"\r\n');
  });
});

describe("fileNameOf", () => {
  it("keeps the words of a title and drops the rest", () => {
    expect(fileNameOf("Attractors of Glimmerfin bloom switch r2")).toBe("Attractors-of-Glimmerfin-bloom-switch-r2");
    expect(fileNameOf("///")).toBe("download");
  });
});

import { describe, expect, it } from "vitest";
import { parseXml } from "./xml-tree";

describe("parseXml", () => {
  it("parseXml keeps child order, drops namespace prefixes and records where each element starts", () => {
    const root = parseXml(
      '<?xml version="1.0"?>\n<m:root xmlns:m="urn:x">\n  <b/><a k="1"/>\n  <b>text</b>\n</m:root>',
    );
    expect(root.name).toBe("root");
    expect(root.children.map((c) => [c.name, c.line, c.column])).toEqual([
      ["b", 3, 3],
      ["a", 3, 7],
      ["b", 4, 3],
    ]);
    expect(root.children[1]!.attrs).toEqual({ k: "1" });
    expect(root.children[2]!.text).toBe("text");
  });

  it("parseXml decodes the predefined entities and character references but nothing else", () => {
    const root = parseXml('<r name="a &lt; b &amp; &#65;&#x42;">x &gt; y</r>');
    expect(root.attrs["name"]).toBe("a < b & AB");
    expect(root.text).toBe("x > y");
  });

  it("parseXml refuses a document type declaration, wherever it is", () => {
    expect(() => parseXml('<?xml version="1.0"?>\n\n  <!doctype r SYSTEM "file:///etc/passwd"><r/>')).toThrow(
      /DOCTYPE declarations are not accepted in model files \(line 3, column 3\)/,
    );
  });
});

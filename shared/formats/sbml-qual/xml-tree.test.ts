import { describe, expect, it } from "vitest";
import { ParseError } from "../../engine/errors";
import { MAX_XML_DEPTH, MAX_XML_ELEMENTS, attr, parseXml } from "./xml-tree";

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

describe("parseXml on hostile and broken input", () => {
  const failure = (text: string) => {
    try {
      parseXml(text);
    } catch (e) {
      if (!(e instanceof ParseError)) throw e;
      return { code: e.code, line: e.line, column: e.column, reason: e.reason };
    }
    throw new Error("parseXml accepted the text");
  };

  it("parseXml refuses elements nested deeper than MAX_XML_DEPTH at the start tag that crosses it, before parsing", () => {
    const nested = (depth: number) => "<a>".repeat(depth) + "</a>".repeat(depth);
    expect(parseXml(nested(MAX_XML_DEPTH)).name).toBe("a");
    expect(failure(nested(MAX_XML_DEPTH + 1))).toMatchObject({
      code: "TOO_DEEP",
      line: 1,
      column: 3 * MAX_XML_DEPTH + 1,
    });
    const apply = "<apply><not/>".repeat(100_000) + "<true/>" + "</apply>".repeat(100_000);
    expect(failure(`<sbml>\n<model>${apply}</model></sbml>`)).toMatchObject({ code: "TOO_DEEP", line: 2 });
  });

  it("parseXml refuses more than MAX_XML_ELEMENTS elements", () => {
    expect(failure(`<r>${"<a/>".repeat(MAX_XML_ELEMENTS)}</r>`)).toMatchObject({ code: "TOO_LARGE", line: 1 });
  });

  it("parseXml says where a file ends early: inside a tag, an attribute value, a comment, or with elements open", () => {
    const head = '<?xml version="1.0"?>\n<sbml level="3">\n  <model id="m">\n';
    expect(failure(head + '    <qual:qualitativeSpecies qual:id="A" qual:c')).toEqual({
      code: "PARSE_ERROR",
      line: 4,
      column: 48, // just after the last character
      reason:
        "the file ends early, inside the start tag <qual:qualitativeSpecies> that starts at line 4, column 5; is it complete?",
    });
    expect(failure(head + '    <x id="unfinished').reason).toMatch(
      /^the file ends early, inside an attribute value of the start tag <x>/,
    );
    expect(failure(head + "    <!-- a note").reason).toMatch(/inside the comment that starts at line 4, column 5/);
    expect(failure(head + "    <a></a")).toMatchObject({ line: 4, column: 11 });
    expect(failure(head + "    <listOfQualitativeSpecies>\n").reason).toBe(
      "the file ends early, before the end tag of <listOfQualitativeSpecies> (opened at line 4, column 5) and 2 enclosing elements; is it complete?",
    );
    expect(failure(head + "    <qual:qualitativeSp")).toMatchObject({ line: 4, column: 24 });
  });

  it("parseXml still describes a mismatched end tag as a syntax error", () => {
    expect(failure('<?xml version="1.0"?>\n<sbml>\n  <model>\n</sbml>\n')).toMatchObject({ line: 4 });
    expect(failure('<?xml version="1.0"?>\n<sbml>\n  <model>\n</sbml>\n').reason).toMatch(/XML syntax error/);
  });

  it("parseXml refuses the names fast-xml-parser keeps off its objects with a ParseError at the name", () => {
    expect(failure("<r>\n  <constructor/>\n</r>")).toMatchObject({
      line: 2,
      column: 4,
      reason: 'the XML name "constructor" is not accepted in model files',
    });
    expect(failure('<r __proto__="1"/>')).toMatchObject({ line: 1, column: 4 });
  });

  it("parseXml gives attributes as an object without a prototype and skips a byte order mark", () => {
    const root = parseXml('\uFEFF<r toString="x" id="1"/>');
    expect(Object.getPrototypeOf(root.attrs)).toBeNull();
    expect(attr(root, "id")).toBe("1");
    expect(attr(root, "valueOf")).toBeUndefined();
    expect(root.column).toBe(1);
  });
});

// Safe XML reading for model files: size limit, no DTDs, no entity expansion, well-formedness errors with line and
// column, then a plain element tree (namespace prefixes dropped) that keeps child order, which MathML needs.
// Parsing is done by fast-xml-parser; the XML rules are those of the W3C "Extensible Markup Language (XML) 1.0".
import { XMLParser, XMLValidator } from "fast-xml-parser";
import { ParseError } from "../../engine/errors";

export interface XmlElement {
  readonly name: string;
  readonly attrs: Readonly<Record<string, string>>;
  readonly children: XmlElement[];
  /** Concatenated text directly inside the element, trimmed. */
  readonly text: string;
  /** 1-based line and column of the element's start tag (0 when unknown). */
  readonly line: number;
  readonly column: number;
}

/** Largest XML text accepted, in characters (20 MiB; model files are far smaller). */
export const MAX_XML_CHARS = 20 * 1024 * 1024;

type OrderedNode = Record<string, unknown>;

const PREDEFINED: Record<string, string> = { amp: "&", lt: "<", gt: ">", quot: '"', apos: "'" };

/** Decode the five predefined entities and character references; entity expansion stays off for everything else. */
function decodeEntities(s: string): string {
  if (!s.includes("&")) return s;
  return s.replace(/&(#x[0-9A-Fa-f]+|#[0-9]+|amp|lt|gt|quot|apos);/g, (whole, ref: string) => {
    if (ref[0] !== "#") return PREDEFINED[ref]!;
    const code = ref[1] === "x" ? parseInt(ref.slice(2), 16) : parseInt(ref.slice(1), 10);
    return code <= 0x10ffff ? String.fromCodePoint(code) : whole;
  });
}

function lineStarts(text: string): number[] {
  const starts = [0];
  for (let i = text.indexOf("\n"); i >= 0; i = text.indexOf("\n", i + 1)) starts.push(i + 1);
  return starts;
}

function positionOf(starts: number[], offset: number): { line: number; column: number } {
  let lo = 0;
  let hi = starts.length - 1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (starts[mid]! <= offset) lo = mid;
    else hi = mid - 1;
  }
  return { line: lo + 1, column: offset - starts[lo]! + 1 };
}

/** Parse XML text into an element tree and return its root element. Throws ParseError. */
export function parseXml(text: string): XmlElement {
  if (text.length > MAX_XML_CHARS)
    throw new ParseError(`the file is larger than ${MAX_XML_CHARS / 1024 / 1024} MiB`, 1, 1, "FILE_TOO_LARGE");
  const starts = lineStarts(text);
  const doctype = text.search(/<!DOCTYPE/i);
  if (doctype >= 0) {
    const at = positionOf(starts, doctype);
    throw new ParseError("DOCTYPE declarations are not accepted in model files", at.line, at.column);
  }
  const valid = XMLValidator.validate(text);
  if (valid !== true) throw new ParseError(`XML syntax error: ${valid.err.msg}`, valid.err.line, valid.err.col);
  const parser = new XMLParser({
    preserveOrder: true,
    ignoreAttributes: false,
    attributeNamePrefix: "",
    removeNSPrefix: true,
    processEntities: false,
    htmlEntities: false,
    parseTagValue: false,
    parseAttributeValue: false,
    trimValues: true,
    captureMetaData: true,
    maxNestedTags: 500,
  });
  const meta = XMLParser.getMetaDataSymbol() as unknown as symbol;
  const convert = (node: OrderedNode): XmlElement | null => {
    const name = Object.keys(node).find((k) => k !== ":@" && k !== "#text");
    if (!name || name.startsWith("?")) return null;
    const rawChildren = (node[name] as OrderedNode[]) ?? [];
    const attrs: Record<string, string> = {};
    for (const [k, v] of Object.entries((node[":@"] as Record<string, string>) ?? {}))
      attrs[k] = decodeEntities(String(v));
    const children: XmlElement[] = [];
    let text = "";
    for (const child of rawChildren) {
      if ("#text" in child) text += decodeEntities(String(child["#text"]));
      else {
        const c = convert(child);
        if (c) children.push(c);
      }
    }
    const start = (node as Record<symbol, { startIndex?: number } | undefined>)[meta]?.startIndex;
    const at = start === undefined ? { line: 0, column: 0 } : positionOf(starts, start);
    return { name, attrs, children, text: text.trim(), line: at.line, column: at.column };
  };
  const top = parser.parse(text) as OrderedNode[];
  for (const node of top) {
    const element = convert(node);
    if (element) return element;
  }
  throw new ParseError("the file has no XML root element", 1, 1);
}

export const childrenNamed = (e: XmlElement, name: string) => e.children.filter((c) => c.name === name);
export const childNamed = (e: XmlElement, name: string) => e.children.find((c) => c.name === name);

/** Where an element is, for error messages: "line L" or "" when unknown. */
export const whereIs = (e: XmlElement) => (e.line > 0 ? ` (line ${e.line})` : "");

// Safe XML reading for model files: size limit, no DTDs, no entity expansion, well-formedness errors with line and
// column, then a plain element tree (namespace prefixes dropped) that keeps child order, which MathML needs.
// Parsing is done by fast-xml-parser; the XML rules are those of the W3C "Extensible Markup Language (XML) 1.0".
// A linear pre-scan of the markup comes first: it bounds nesting depth and element count before any tree is built,
// and tells a file that simply ends early from one that is malformed.
import { XMLParser, XMLValidator } from "fast-xml-parser";
import { ParseError } from "../../engine/errors";
import { showInput } from "../../engine/rules";

export interface XmlElement {
  readonly name: string;
  /** Attributes by local name; a null-prototype object, so no name reads an inherited property. */
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

/**
 * Deepest element nesting accepted. SBML-qual wraps function terms in seven levels, and each MathML operator is one
 * more, so this leaves room for rules nested to the rule-text limit (MAX_NESTING_DEPTH) and no more.
 */
export const MAX_XML_DEPTH = 600;

/** Most elements accepted in one file: each costs a few hundred bytes in the parsed tree. */
export const MAX_XML_ELEMENTS = 1_000_000;

type OrderedNode = Record<string, unknown>;

const PREDEFINED: ReadonlyMap<string, string> = new Map([
  ["amp", "&"],
  ["lt", "<"],
  ["gt", ">"],
  ["quot", '"'],
  ["apos", "'"],
]);

/** Decode the five predefined entities and character references; entity expansion stays off for everything else. */
function decodeEntities(s: string): string {
  if (!s.includes("&")) return s;
  return s.replace(/&(#x[0-9A-Fa-f]+|#[0-9]+|amp|lt|gt|quot|apos);/g, (whole, ref: string) => {
    if (ref[0] !== "#") return PREDEFINED.get(ref)!;
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

const isNameEnd = (c: string | undefined) =>
  c === undefined || c === " " || c === "\t" || c === "\n" || c === "\r" || c === "/" || c === ">";

/**
 * One pass over the markup: comments, CDATA sections, processing instructions and tags (quoted attribute values may
 * hold `>`). Throws ParseError when elements nest deeper than MAX_XML_DEPTH, when there are more than
 * MAX_XML_ELEMENTS, or when the text ends inside a construct or with elements still open. A mismatched end tag ends
 * the scan quietly: the validator describes that better.
 */
function scanMarkup(text: string, starts: number[]): void {
  const open: number[] = []; // start offsets of the open elements
  const names: string[] = [];
  let elements = 0;
  let rootName = "";
  const endsEarly = (what: string): never => {
    const at = positionOf(starts, text.length);
    throw new ParseError(`the file ends early, ${what}; is it complete?`, at.line, at.column);
  };
  const where = (offset: number) => {
    const at = positionOf(starts, offset);
    return `line ${at.line}, column ${at.column}`;
  };
  const closeAt = (from: number, marker: string, what: string): number => {
    const end = text.indexOf(marker, from);
    if (end < 0) endsEarly(what);
    return end + marker.length;
  };
  let i = text.indexOf("<");
  while (i >= 0) {
    if (text.startsWith("<!--", i)) i = closeAt(i + 4, "-->", `inside the comment that starts at ${where(i)}`);
    else if (text.startsWith("<![CDATA[", i))
      i = closeAt(i + 9, "]]>", `inside the CDATA section that starts at ${where(i)}`);
    else if (text.startsWith("<?", i))
      i = closeAt(i + 2, "?>", `inside the processing instruction that starts at ${where(i)}`);
    else if (text.startsWith("<!", i)) i = closeAt(i + 2, ">", `inside the declaration that starts at ${where(i)}`);
    else if (text.startsWith("</", i)) {
      let j = i + 2;
      while (!isNameEnd(text[j])) j++;
      const name = text.slice(i + 2, j);
      const end = text.indexOf(">", j);
      if (end < 0) endsEarly(`inside the end tag </${showInput(name)}> that starts at ${where(i)}`);
      if (names[names.length - 1] !== name) return;
      names.pop();
      open.pop();
      i = end + 1;
    } else {
      let j = i + 1;
      while (!isNameEnd(text[j])) j++;
      const name = text.slice(i + 1, j);
      // A `<` that starts no name is a syntax error, not the start of an element: the validator will name it.
      if (j >= text.length) endsEarly(`inside the tag that starts at ${where(i)}`);
      if (!/^[A-Za-z_:\u00C0-\uFFFF]/.test(name)) return;
      // The tag ends at the first `>` outside a quoted attribute value.
      let quote = "";
      for (; j < text.length; j++) {
        const c = text[j]!;
        if (quote) {
          if (c === quote) quote = "";
        } else if (c === '"' || c === "'") quote = c;
        else if (c === ">") break;
      }
      if (j >= text.length)
        endsEarly(
          `${quote ? "inside an attribute value of" : "inside"} the start tag <${showInput(name)}> that starts at ${where(i)}`,
        );
      if (open.length === 0 && elements > 0) {
        const at = positionOf(starts, i);
        throw new ParseError(
          `another element <${showInput(name)}> after the root element <${showInput(rootName)}> has ended; an XML document has exactly one root`,
          at.line,
          at.column,
        );
      }
      if (elements === 0) rootName = name;
      if (++elements > MAX_XML_ELEMENTS) {
        const at = positionOf(starts, i);
        throw new ParseError(
          `the file has more than ${MAX_XML_ELEMENTS} elements, the most a model file may have`,
          at.line,
          at.column,
          "TOO_LARGE",
        );
      }
      if (text[j - 1] !== "/") {
        open.push(i);
        names.push(name);
        if (open.length > MAX_XML_DEPTH) {
          const at = positionOf(starts, i);
          throw new ParseError(
            `elements are nested more than ${MAX_XML_DEPTH} deep here; a model file may nest at most ${MAX_XML_DEPTH}`,
            at.line,
            at.column,
            "TOO_DEEP",
          );
        }
      }
      i = j + 1;
    }
    i = text.indexOf("<", i);
  }
  if (open.length > 0) {
    const last = open.length - 1;
    const others = last === 0 ? "" : ` and ${last} enclosing element${last === 1 ? "" : "s"}`;
    endsEarly(`before the end tag of <${showInput(names[last]!)}> (opened at ${where(open[last]!)})${others}`);
  }
}

/** Where a name that fast-xml-parser refuses first appears as an element or attribute name. */
function offsetOfName(text: string, name: string): number {
  const m = new RegExp(`[<\\s:]${name}[\\s=/>]`).exec(text);
  return m ? m.index + 1 : 0;
}

/**
 * Parse XML text into an element tree and return its root element. Throws ParseError. A leading byte order mark is
 * dropped (columns of the first line count from the character after it).
 */
export function parseXml(withBom: string): XmlElement {
  const text = withBom.charCodeAt(0) === 0xfeff ? withBom.slice(1) : withBom;
  if (text.length > MAX_XML_CHARS)
    throw new ParseError(`the file is larger than ${MAX_XML_CHARS / 1024 / 1024} MiB`, 1, 1, "FILE_TOO_LARGE");
  const starts = lineStarts(text);
  const doctype = text.search(/<!DOCTYPE/i);
  if (doctype >= 0) {
    const at = positionOf(starts, doctype);
    throw new ParseError("DOCTYPE declarations are not accepted in model files", at.line, at.column);
  }
  if (text.trim() === "") throw new ParseError("the file is empty; an SBML-qual file holds an <sbml> element", 1, 1);
  scanMarkup(text, starts);
  const valid = XMLValidator.validate(text);
  if (valid !== true)
    throw new ParseError(`XML syntax error: ${showInput(valid.err.msg, 200)}`, valid.err.line || 1, valid.err.col || 1);
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
    // The pre-scan already refused anything deeper; this is the parser's own guard, one level beyond.
    maxNestedTags: MAX_XML_DEPTH + 1,
  });
  const meta = XMLParser.getMetaDataSymbol() as unknown as symbol;
  const convert = (node: OrderedNode): XmlElement | null => {
    const name = Object.keys(node).find((k) => k !== ":@" && k !== "#text");
    if (!name || name.startsWith("?")) return null;
    const rawChildren = (node[name] as OrderedNode[]) ?? [];
    const attrs: Record<string, string> = Object.create(null) as Record<string, string>;
    for (const [k, v] of Object.entries((node[":@"] as Record<string, string>) ?? {}))
      attrs[k] = decodeEntities(String(v));
    const children: XmlElement[] = [];
    let text = "";
    for (const child of rawChildren) {
      if (Object.hasOwn(child, "#text")) text += decodeEntities(String(child["#text"]));
      else {
        const c = convert(child);
        if (c) children.push(c);
      }
    }
    const start = (node as Record<symbol, { startIndex?: number } | undefined>)[meta]?.startIndex;
    const at = start === undefined ? { line: 0, column: 0 } : positionOf(starts, start);
    return { name, attrs, children, text: text.trim(), line: at.line, column: at.column };
  };
  let top: OrderedNode[];
  try {
    top = parser.parse(text) as OrderedNode[];
  } catch (e) {
    // fast-xml-parser refuses names that would reach an object's prototype (__proto__, constructor, prototype).
    const refused = /Invalid name: "([^"]*)"/.exec(String(e));
    const at = positionOf(starts, refused ? offsetOfName(text, refused[1]!) : 0);
    const reason = refused
      ? `the XML name "${showInput(refused[1]!)}" is not accepted in model files`
      : `XML syntax error: ${showInput(String(e), 200)}`;
    throw new ParseError(reason, at.line, at.column);
  }
  for (const node of top) {
    const element = convert(node);
    if (element) return element;
  }
  throw new ParseError("the file has no XML root element", 1, 1);
}

export const childrenNamed = (e: XmlElement, name: string) => e.children.filter((c) => c.name === name);
export const childNamed = (e: XmlElement, name: string) => e.children.find((c) => c.name === name);

/** An attribute's value, or undefined; own attributes only. */
export const attr = (e: XmlElement, name: string): string | undefined =>
  Object.hasOwn(e.attrs, name) ? e.attrs[name] : undefined;

// Where a node's label goes: beside the node, on whichever side keeps it inside the drawing area. The same rule
// runs in sigma's label layer and in the SVG writer, so no label is cut off at the edge of either.

export const LABEL_FONT_SIZE = 13;
/** Gap between a node's rim and its label, in pixels. */
export const LABEL_GAP = 4;

/**
 * Width of a text in the UI font (Inter, semi-bold) without a DOM to measure it: per-character advance widths in
 * em, rounded up from the font's metrics so an estimate errs on the wide side.
 */
export function estimateTextWidth(text: string, fontSize = LABEL_FONT_SIZE): number {
  let em = 0;
  for (const ch of text) {
    if ("il.,:;'|!()[]ıj ".includes(ch)) em += 0.32;
    else if ("mwMW@%".includes(ch)) em += 0.9;
    else if (ch >= "A" && ch <= "Z") em += 0.7;
    else if (ch >= "0" && ch <= "9") em += 0.62;
    else if (ch.charCodeAt(0) > 0x2000)
      em += 0.9; // arrows, ≡ and other symbols
    else em += 0.58;
  }
  return em * fontSize;
}

export interface LabelPlacement {
  /** x of the text's anchor point. */
  x: number;
  anchor: "start" | "end";
}

/**
 * The label of a node at x (radius r) goes right of the node unless it would pass `right`; then left of it, unless
 * that passes `left` too, in which case the side with more room wins.
 */
export function placeLabel(x: number, radius: number, textWidth: number, left: number, right: number): LabelPlacement {
  const offset = radius + LABEL_GAP;
  const fitsRight = x + offset + textWidth <= right;
  const fitsLeft = x - offset - textWidth >= left;
  const goRight = fitsRight || (!fitsLeft && right - x >= x - left);
  return goRight ? { x: x + offset, anchor: "start" } : { x: x - offset, anchor: "end" };
}

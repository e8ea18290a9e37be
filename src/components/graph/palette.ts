// Every colour a graph uses, on screen and in its PNG and SVG exports alike, so the three never disagree.
//
// The qualitative palette is the eight-colour set of Okabe and Ito, "Color Universal Design (CUD): how to make
// figures and presentations that are friendly to colorblind people" (J*Fly, 2008; reprinted as Wong, "Points of
// view: Color blindness", Nature Methods 8:441, 2011), chosen to stay distinct under the common colour-vision
// deficiencies. The order below puts light and dark, warm and cool hues next to each other, so neighbouring entries
// (block sizes k and k + 1, blocks j and j + 1) differ in lightness as well as hue. Its yellow is last because a
// thin yellow line on white is faint.
import type { EdgeSign } from "@shared/schemas/models";

export const QUALITATIVE = [
  "#0072B2", // blue
  "#E69F00", // orange
  "#009E73", // bluish green
  "#CC79A7", // reddish purple
  "#56B4E9", // sky blue
  "#D55E00", // vermillion
  "#000000", // black
  "#F0E442", // yellow
] as const;

/** The palette entry for index i; indices past the end reuse the last colour (a legend then says "≥"). */
export function qualitativeColour(i: number): string {
  return QUALITATIVE[Math.min(QUALITATIVE.length - 1, Math.max(0, i))]!;
}

/** Colours that recur: positive and negative regulation from the same palette (green and vermillion stay apart for
 * red-green deficiencies), plus the neutral greys of nodes, muted items and text. */
export const SIGN_COLOURS: Record<EdgeSign, string> = {
  positive: "#009E73",
  negative: "#D55E00",
  dual: "#CC79A7",
  "non-essential": "#94A3B8",
};

export const NODE_COLOUR = "#334155";
export const MUTED_COLOUR = "#CBD5E1";
export const FOCUS_COLOUR = "#B45309";
export const TEXT_COLOUR = "#0F172A";
export const BACKGROUND_COLOUR = "#FFFFFF";
/** Node colours for a painted state: on and off. */
export const STATE_COLOURS = { on: "#0072B2", off: "#CBD5E1" } as const;
/** Fixed context nodes of a block emulation: light for 0, dark for 1. */
export const CONTEXT_COLOURS = { 0: "#CBD5E1", 1: "#475569" } as const;

export const GRAPH_FONT = '"Inter Variable", Inter, Arial, sans-serif';

// How a regulation's sign is drawn and said, the same in every wiring picture: colour, head and words.
import type { EdgeSign } from "@shared/schemas/models";
import type { EdgeHead } from "./graph-scene";
import { SIGN_COLOURS } from "./palette";

export const signStyle: Record<EdgeSign, { color: string; head: EdgeHead; verb: string; label: string }> = {
  positive: { color: SIGN_COLOURS.positive, head: "arrow", verb: "activates", label: "activates" },
  negative: { color: SIGN_COLOURS.negative, head: "bar", verb: "represses", label: "represses" },
  dual: {
    color: SIGN_COLOURS.dual,
    head: "arrow",
    verb: "regulates both ways",
    label: "dual (both, depending on context)",
  },
  "non-essential": {
    color: SIGN_COLOURS["non-essential"],
    head: "arrow",
    verb: "is read by, but never changes,",
    label: "read but never matters",
  },
};

/** "A represses B", or "A represses itself". */
export const describeRegulation = (source: string, target: string, sign: EdgeSign) =>
  `${source} ${signStyle[sign].verb} ${source === target ? "itself" : target}`;

// What a run is called on screen: what it did and on what ("Attractors of Glimmerfin bloom switch r2"), and, for a
// search that found nothing, the sentence that says so with its bounds. Pure, so the list, the page and the tests
// agree on one wording.
import type { Run, RunModelRef } from "@shared/schemas/runs";

const ref = (m: RunModelRef | null) => (m ? `${m.modelName} r${m.revision}` : null);
const obj = (v: unknown): Record<string, unknown> => (typeof v === "object" && v !== null ? (v as never) : {});

function nodeCountOf(ruleText: unknown): number | null {
  if (typeof ruleText !== "string") return null;
  return ruleText.split("\n").filter((l) => /^\s*[A-Za-z_][\w]*\s*'?\s*[=:]/.test(l)).length || null;
}

export function runTitle(run: Pick<Run, "kind" | "params" | "model" | "targetModel">): string {
  const p = obj(run.params);
  const source = ref(run.model) ?? "a model";
  switch (run.kind) {
    case "attractors": {
      if (run.model) return `Attractors of ${source}`;
      const n = nodeCountOf(p.ruleText);
      return `Attractors of rule text${n ? ` (${n} nodes)` : ""}`;
    }
    case "reduction-search": {
      const s = obj(p.search);
      if (s.mode === "coarse-grain")
        return `Coarse-graining of ${source} onto ${Array.isArray(s.observe) ? s.observe.join(", ") : "observables"}`;
      if (s.mode === "discover") return `Smaller networks emulated by ${source}`;
      const notion = s.notion === "dynamical-embedding" ? "Dynamical embedding" : "Block emulation";
      return `${notion} of ${ref(run.targetModel) ?? "a target"} by ${source}`;
    }
    case "eca-hierarchy":
      return `Elementary-rule hierarchy, blocks ≤ ${String(p.maxBlock ?? "?")}`;
    case "node-elimination":
      return p.mode === "percolate"
        ? `Percolation of constants in ${source}`
        : `Node elimination in ${source}${p.mode === "all-eligible" ? " (all eligible nodes)" : ""}`;
    case "sleep-count":
      return `Demonstration count of ${String(p.itemCount ?? "?")} items`;
    default:
      return run.kind;
  }
}

export interface SearchBoundsLine {
  label: string;
  value: string;
}

/** The bounds a reduction search ran within, as a person reads them. */
export function searchBounds(search: Record<string, unknown>): SearchBoundsLine[] {
  const lines: SearchBoundsLine[] = [];
  if (search.mode === "coarse-grain") {
    lines.push({ label: "Observed nodes", value: Array.isArray(search.observe) ? search.observe.join(", ") : "" });
    lines.push({ label: "Time scale", value: `t = ${String(search.time ?? 1)}` });
    return lines;
  }
  if (search.mode === "discover")
    lines.push({ label: "Target size", value: `≤ ${String(search.maxTargetNodes)} nodes` });
  if (search.notion !== "dynamical-embedding")
    lines.push({ label: "Block size", value: `≤ ${String(search.maxBlock)} source nodes per target node` });
  lines.push({ label: "Time scale", value: `t ≤ ${String(search.maxTime)}` });
  if (search.notion !== "dynamical-embedding")
    lines.push({ label: "Context nodes", value: search.allowContext === false ? "not allowed" : "allowed" });
  return lines;
}

/** The sentence for a search that found nothing, e.g. "No block emulation with blocks ≤ 3 at t ≤ 2". */
export function nothingFoundSentence(search: Record<string, unknown>): string {
  if (search.mode === "coarse-grain") {
    const observed = Array.isArray(search.observe) ? search.observe.join(", ") : "the observed nodes";
    return `No coarse-graining onto ${observed} at t = ${String(search.time ?? 1)}: their values do not predict themselves`;
  }
  if (search.mode === "discover")
    return `No smaller network on ≤ ${String(search.maxTargetNodes)} nodes emulated with blocks ≤ ${String(search.maxBlock)} at t ≤ ${String(search.maxTime)}`;
  if (search.notion === "dynamical-embedding") return `No dynamical embedding at t ≤ ${String(search.maxTime)}`;
  return `No block emulation with blocks ≤ ${String(search.maxBlock)} at t ≤ ${String(search.maxTime)}`;
}

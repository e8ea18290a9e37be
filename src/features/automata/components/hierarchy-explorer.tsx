// The hierarchy screen's body: pick a stored hierarchy, filter it, and draw it.
import { useMemo, useState } from "react";
import { useNavigate } from "react-router-dom";
import type { Hierarchy, HierarchyParameters } from "@shared/schemas/automata";
import { ApiError } from "@/lib/api-client";
import { useHierarchy } from "../api/get-hierarchy";
import { buildHierarchyGraph } from "../lib/hierarchy-graph-model";
import { blockSizeColour, LARGEST_COLOURED_BLOCK } from "../lib/hierarchy-scene";
import { HierarchyGraph } from "./hierarchy-graph";
import { HierarchyFilters, type HierarchyFilterValues } from "./hierarchy-filters";

export interface HierarchyExplorerProps {
  params: HierarchyParameters;
  /** Shown when the hierarchy is not stored and must come from a background run. */
  notStoredSlot?: React.ReactNode;
}

function parseSearch(text: string): { rule: number | null; error: string | null } {
  const t = text.trim();
  if (t === "") return { rule: null, error: null };
  if (!/^\d{1,3}$/.test(t) || Number(t) > 255)
    return { rule: null, error: "A rule number is a whole number from 0 to 255" };
  return { rule: Number(t), error: null };
}

function Legend({ largest }: { largest: number }) {
  return (
    <div className="flex flex-wrap items-center gap-3 text-xs text-slate-600" aria-label="Edge colours">
      <span>Arrow colour = least block size k:</span>
      {Array.from({ length: Math.min(largest, LARGEST_COLOURED_BLOCK) }, (_, i) => i + 1).map((k) => (
        <span key={k} className="flex items-center gap-1">
          <span className="inline-block h-1 w-5 rounded" style={{ background: blockSizeColour(k) }} />
          {k === LARGEST_COLOURED_BLOCK && largest > k ? `≥ ${k}` : k}
        </span>
      ))}
    </div>
  );
}

function Loaded({ hierarchy }: { hierarchy: Hierarchy }) {
  const navigate = useNavigate();
  const [filters, setFilters] = useState<HierarchyFilterValues>({
    minBlock: 2,
    maxBlock: hierarchy.maxBlock,
    bySymmetryClass: true,
    search: "",
  });
  const { rule: searchRule, error: searchError } = parseSearch(filters.search);
  const model = useMemo(
    () =>
      buildHierarchyGraph(hierarchy.pairs, hierarchy.symmetryClasses, {
        minBlock: filters.minBlock,
        maxBlock: Math.min(filters.maxBlock, hierarchy.maxBlock),
        bySymmetryClass: filters.bySymmetryClass,
      }),
    [hierarchy, filters.minBlock, filters.maxBlock, filters.bySymmetryClass],
  );
  const notDrawn = searchRule !== null && !model.nodes.some((n) => n.rules.includes(searchRule));
  return (
    <div className="space-y-3">
      <HierarchyFilters
        values={filters}
        largestBlock={hierarchy.maxBlock}
        onChange={setFilters}
        searchError={searchError}
      />
      <p className="text-sm text-slate-600" data-testid="hierarchy-stats">
        {hierarchy.pairs.filter((p) => p.source !== p.target && !p.composed).length} emulating pairs for block sizes up
        to {hierarchy.maxBlock} (plus {hierarchy.pairs.filter((p) => p.composed).length} more by composition)
        {" · "}drawn: {model.nodes.length} nodes and {model.edges.length} arrows (transitive reduction of{" "}
        {model.pairsInRange} pairs with k in {filters.minBlock}..{filters.maxBlock}){" · "}
        {hierarchy.emulateNothing.length} rules emulate nothing with 2 ≤ k ≤ {hierarchy.maxBlock}
        {" · "}computed {new Date(hierarchy.computedAt).toLocaleString()} in {(hierarchy.durationMs / 1000).toFixed(1)}{" "}
        s{hierarchy.computedBy ? ` by ${hierarchy.computedBy.displayName}` : ""}
      </p>
      {notDrawn && (
        <p className="text-sm text-amber-700">
          Rule {searchRule} has no arrow in this range;{" "}
          <button type="button" className="underline" onClick={() => navigate(`/automata/rules/${searchRule}`)}>
            open its page
          </button>
          .
        </p>
      )}
      <Legend largest={hierarchy.maxBlock} />
      {model.nodes.length === 0 ? (
        <p className="rounded-lg border border-slate-200 bg-white p-6 text-sm text-slate-600">
          No emulation with a least block size in this range.
        </p>
      ) : (
        <HierarchyGraph
          model={model}
          highlightRule={searchRule}
          onOpenRule={(r) => navigate(`/automata/rules/${r}?maxBlock=${hierarchy.maxBlock}`)}
          fileName={`eca-hierarchy-k${filters.minBlock}-${filters.maxBlock}`}
        />
      )}
      <p className="text-xs text-slate-500">
        Hover a node (or Tab to it in the lists under the graph) to see its arrows with their block sizes; click it (or
        press Enter) to open the rule. With symmetry classes on, a node is named by the least rule of its class (bigger
        dots are bigger classes); "≡" joins nodes that emulate each other.
      </p>
    </div>
  );
}

export function HierarchyExplorer({ params, notStoredSlot }: HierarchyExplorerProps) {
  const query = useHierarchy(params);
  if (query.isPending) {
    return (
      <p className="text-sm text-slate-600" role="status">
        Loading the hierarchy for block sizes up to {params.maxBlock}
        {params.maxBlock <= 11 ? " (computed on first use, a few seconds)" : ""}…
      </p>
    );
  }
  if (query.isError) {
    const err = query.error;
    if (err instanceof ApiError && err.code === "HIERARCHY_NOT_COMPUTED") {
      return (
        <div className="space-y-3" data-testid="hierarchy-not-computed">
          <p className="text-sm text-slate-700">{err.message}</p>
          {notStoredSlot}
        </div>
      );
    }
    return (
      <p className="text-sm text-red-700" role="alert">
        {err.message}
      </p>
    );
  }
  return <Loaded key={`${params.maxBlock}/${params.timeMode}`} hierarchy={query.data} />;
}

// /automata: the block-emulation hierarchy of the 256 elementary cellular automata.
import { useSearchParams } from "react-router-dom";
import { HierarchyParameters } from "@shared/schemas/automata";
import { BlockEmulationHelp } from "@/features/automata/components/block-emulation-help";
import { HierarchyExplorer } from "@/features/automata/components/hierarchy-explorer";
import { HierarchyRunPanel } from "@/features/automata/components/hierarchy-run-panel";
import { useHierarchies } from "@/features/automata/api/get-hierarchies";

export function useHierarchyParams(): HierarchyParameters {
  const [search] = useSearchParams();
  const parsed = HierarchyParameters.safeParse({
    maxBlock: search.get("maxBlock") ?? undefined,
    timeMode: search.get("timeMode") ?? undefined,
  });
  return parsed.success ? parsed.data : { maxBlock: 11, timeMode: "block", radius: 1 };
}

export function AutomataRoute() {
  const params = useHierarchyParams();
  const [, setSearch] = useSearchParams();
  const stored = useHierarchies();
  const storedBlocks = new Set(
    (stored.data ?? []).filter((h) => h.timeMode === params.timeMode).map((h) => h.maxBlock),
  );
  return (
    <section className="space-y-4">
      <div className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <h1 className="text-2xl font-semibold">Emulation between elementary cellular automata</h1>
          <p className="max-w-3xl text-sm text-slate-600">
            Which of the 256 elementary rules can imitate which, using blocks of cells as big cells. This is the
            cellular-automaton case of the emulation Emulant looks for between regulatory networks.
          </p>
        </div>
        <label className="flex flex-col gap-1 text-sm text-slate-700">
          Block sizes up to
          <select
            className="rounded-md border border-slate-300 px-2 py-1 text-sm"
            value={params.maxBlock}
            data-testid="hierarchy-max-block"
            onChange={(e) => setSearch({ maxBlock: e.target.value, timeMode: params.timeMode })}
          >
            {Array.from({ length: 19 }, (_, i) => i + 2).map((k) => (
              <option key={k} value={k}>
                {k}
                {storedBlocks.has(k) ? " (stored)" : k <= 11 ? "" : " (background run)"}
              </option>
            ))}
          </select>
        </label>
      </div>
      <BlockEmulationHelp />
      <HierarchyExplorer params={params} notStoredSlot={<HierarchyRunPanel params={params} />} />
    </section>
  );
}

// One side of a rule's relations: the rules it emulates, or the rules that emulate it, by least block size.
import { Link } from "react-router-dom";
import type { HierarchyPairWithWitness } from "@shared/schemas/automata";

export interface EmulationListProps {
  title: string;
  pairs: HierarchyPairWithWitness[];
  /** Which end of each pair to show: the other rule. */
  side: "source" | "target";
  selected: { source: number; target: number } | null;
  onSelect(pair: HierarchyPairWithWitness): void;
  emptyText: string;
  testId: string;
}

export function EmulationList({ title, pairs, side, selected, onSelect, emptyText, testId }: EmulationListProps) {
  return (
    <section className="space-y-2" data-testid={testId}>
      <h2 className="text-base font-semibold text-slate-800">
        {title} <span className="font-normal text-slate-500">({pairs.length})</span>
      </h2>
      {pairs.length === 0 ? (
        <p className="text-sm text-slate-500">{emptyText}</p>
      ) : (
        <ul className="flex flex-wrap gap-1.5">
          {pairs.map((p) => {
            const other = p[side];
            const isSelected = selected?.source === p.source && selected.target === p.target;
            return (
              <li key={`${p.source}-${p.target}`} className="flex">
                <button
                  type="button"
                  onClick={() => onSelect(p)}
                  aria-pressed={isSelected}
                  title={`Show the witness: block size ${p.minBlock}, time ${p.witness.time}`}
                  className={`rounded-l-md border px-2 py-1 text-sm ${isSelected ? "border-brand-700 bg-brand-700 text-white" : "border-slate-300 bg-white text-slate-800 hover:bg-brand-50"}`}
                >
                  {other} <span className={isSelected ? "text-brand-100" : "text-slate-500"}>k={p.minBlock}</span>
                </button>
                <Link
                  to={`/automata/rules/${other}`}
                  className="rounded-r-md border border-l-0 border-slate-300 bg-slate-50 px-1.5 py-1 text-xs text-slate-600 hover:bg-slate-100"
                  aria-label={`Open rule ${other}`}
                >
                  ↗
                </Link>
              </li>
            );
          })}
        </ul>
      )}
    </section>
  );
}

// One rule: its own space-time diagram, what it emulates and what emulates it, and for a chosen pair the witness
// checked row by row and drawn as two runs side by side.
import { useState } from "react";
import { Link } from "react-router-dom";
import type { HierarchyParameters, HierarchyPairWithWitness } from "@shared/schemas/automata";
import { useRuleEmulations } from "../api/get-rule-emulations";
import { useWitness } from "../api/get-witness";
import { EmulationList } from "./emulation-list";
import { RuleDiagram } from "./rule-diagram";
import { WitnessChecks } from "./witness-checks";
import { WitnessDiagram } from "./witness-diagram";

function WitnessPanel({ pair, params }: { pair: { source: number; target: number }; params: HierarchyParameters }) {
  const query = useWitness(pair.source, pair.target, params);
  return (
    <section className="space-y-3 rounded-lg border border-slate-200 bg-white p-4" data-testid="witness-panel">
      <h2 className="text-base font-semibold text-slate-800">
        Rule{" "}
        <Link className="text-brand-700 underline" to={`/automata/rules/${pair.source}?maxBlock=${params.maxBlock}`}>
          {pair.source}
        </Link>{" "}
        emulates rule{" "}
        <Link className="text-brand-700 underline" to={`/automata/rules/${pair.target}?maxBlock=${params.maxBlock}`}>
          {pair.target}
        </Link>
      </h2>
      {query.isPending && (
        <p className="text-sm text-slate-600" role="status">
          Checking the witness…
        </p>
      )}
      {query.isError && (
        <p className="text-sm text-red-700" role="alert">
          {query.error.message}
        </p>
      )}
      {query.data && (
        <>
          <WitnessChecks report={query.data} />
          <WitnessDiagram report={query.data} />
        </>
      )}
    </section>
  );
}

export function RuleExplorer({ rule, params }: { rule: number; params: HierarchyParameters }) {
  const query = useRuleEmulations(rule, params);
  const [chosen, setChosen] = useState<{ source: number; target: number } | null>(null);
  const data = query.data;
  // until the user picks, show the first non-trivial pair so the page always has a witness to look at
  const nonTrivial = (p: HierarchyPairWithWitness) => p.source !== p.target;
  const fallback = data ? (data.emulates.find(nonTrivial) ?? data.emulatedBy.find(nonTrivial) ?? null) : null;
  const selected = chosen ?? (fallback ? { source: fallback.source, target: fallback.target } : null);
  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-start gap-8">
        <RuleDiagram rule={rule} />
        <div className="min-w-64 flex-1 space-y-4">
          {query.isPending && (
            <p className="text-sm text-slate-600" role="status">
              Loading what rule {rule} emulates…
            </p>
          )}
          {query.isError && (
            <p className="text-sm text-red-700" role="alert">
              {query.error.message}
            </p>
          )}
          {data && (
            <>
              <p className="text-sm text-slate-600">
                Symmetry class:{" "}
                {data.symmetryClass.map((r, i) => (
                  <span key={r}>
                    {i > 0 && ", "}
                    {r === rule ? (
                      <strong>{r}</strong>
                    ) : (
                      <Link
                        className="text-brand-700 underline"
                        to={`/automata/rules/${r}?maxBlock=${params.maxBlock}`}
                      >
                        {r}
                      </Link>
                    )}
                  </span>
                ))}{" "}
                (reflection and 0/1 complement). Block sizes up to {data.maxBlock}.
              </p>
              <EmulationList
                title={`Rule ${rule} emulates`}
                pairs={data.emulates.filter(nonTrivial)}
                side="target"
                selected={selected}
                onSelect={(p) => setChosen({ source: p.source, target: p.target })}
                emptyText={`No other rule with a block size up to ${data.maxBlock}.`}
                testId="emulates-list"
              />
              <EmulationList
                title={`Rules that emulate ${rule}`}
                pairs={data.emulatedBy.filter(nonTrivial)}
                side="source"
                selected={selected}
                onSelect={(p) => setChosen({ source: p.source, target: p.target })}
                emptyText={`No other rule with a block size up to ${data.maxBlock}.`}
                testId="emulated-by-list"
              />
            </>
          )}
        </div>
      </div>
      {selected && <WitnessPanel pair={selected} params={params} />}
    </div>
  );
}

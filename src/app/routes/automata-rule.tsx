// /automata/rules/:rule: one elementary rule, what it emulates and what emulates it, with witnesses.
import { Link, useParams } from "react-router-dom";
import { RuleExplorer } from "@/features/automata/components/rule-explorer";
import { useHierarchyParams } from "./automata";

export function AutomataRuleRoute() {
  const { rule: text } = useParams();
  const params = useHierarchyParams();
  const rule = Number(text);
  const valid = text !== undefined && /^\d{1,3}$/.test(text) && rule <= 255;
  return (
    <section className="space-y-4">
      <nav className="text-sm">
        <Link to={`/automata?maxBlock=${params.maxBlock}`} className="text-brand-700 underline">
          ← Hierarchy
        </Link>
      </nav>
      {valid ? (
        <>
          <h1 className="text-2xl font-semibold" data-testid="rule-title">
            Rule {rule}
          </h1>
          <RuleExplorer key={rule} rule={rule} params={params} />
        </>
      ) : (
        <p className="text-sm text-red-700" role="alert">
          "{text}" is not an elementary rule: rule numbers run from 0 to 255.
        </p>
      )}
    </section>
  );
}

// The full ranked list a search keeps on its run: which findings are already in review, which were held back and
// why (flagged as uninformative, or beyond the few best that enter review by themselves), each with a one-click
// "Propose" for the modeler.
import { Link } from "react-router-dom";
import { ReductionSearchResult } from "@shared/schemas/reductions";
import { ApiError } from "@/lib/api-client";
import { plural } from "@/lib/plural";
import { useProposeFinding } from "../api/propose-finding";

const flagWords: Record<string, string> = {
  constant: "every state goes to one state",
  identity: "nothing moves",
  decoupled: "no node reads another",
  trivial: "uninformative",
  isomorphic: "the same dynamics renamed",
};

export function SearchFindings({
  projectId,
  runId,
  result: raw,
  canPropose,
}: {
  projectId: string;
  runId: string;
  result: unknown;
  canPropose: boolean;
}) {
  const parsed = ReductionSearchResult.safeParse(raw);
  const propose = useProposeFinding(projectId, runId);
  if (!parsed.success) return null;
  const r = parsed.data;
  const inReview = r.findings.filter((f) => f.reductionId).length;
  const { notListed, flagged, beyondLimit } = r.heldBack;
  return (
    <section className="space-y-3" data-testid="search-findings">
      <h3 className="text-sm font-semibold text-slate-900">Findings of this search</h3>
      <p className="text-sm text-slate-600" data-testid="findings-explained">
        {r.mode === "discover"
          ? `The search found ${plural(r.distinctTargets, "distinct target")}. `
          : r.found
            ? "The search found a reduction. "
            : "The search found nothing within its bounds. "}
        {plural(inReview, "finding is", "findings are")} in review.
        {flagged > 0 && ` ${plural(flagged, "finding was", "findings were")} held back as uninformative (flags below).`}
        {beyondLimit > 0 &&
          ` ${plural(beyondLimit, "more finding waits", "more findings wait")} here: only the ten best enter review by themselves.`}
        {notListed > 0 &&
          ` ${plural(notListed, "lower-ranked target is", "lower-ranked targets are")} counted, not kept.`}
      </p>
      {propose.error && (
        <p role="alert" className="rounded-md bg-red-50 px-3 py-2 text-sm text-red-800">
          {propose.error instanceof ApiError ? propose.error.message : "The request failed"}
        </p>
      )}
      {r.findings.length > 0 && (
        <div className="max-h-96 overflow-auto rounded-lg border border-slate-200 bg-white">
          <table className="min-w-full text-sm">
            <thead className="bg-slate-50 text-left text-xs uppercase text-slate-500">
              <tr>
                <th className="px-3 py-2">Rank</th>
                <th className="px-3 py-2">Target</th>
                <th className="px-3 py-2">t</th>
                <th className="px-3 py-2">Flags</th>
                <th className="px-3 py-2">Review</th>
              </tr>
            </thead>
            <tbody>
              {r.findings.map((f) => (
                <tr key={f.rank} className="border-t border-slate-100" data-testid="finding-row">
                  <td className="px-3 py-2">{f.rank + 1}</td>
                  <td className="px-3 py-2 text-slate-700">
                    {f.certificate.notion.replace(/-/g, " ")} onto {plural(f.certificate.target.nodes.length, "node")}:{" "}
                    {f.certificate.target.nodes.map((n) => n.name).join(", ")}
                  </td>
                  <td className="px-3 py-2">{f.certificate.time}</td>
                  <td className="px-3 py-2 text-xs text-slate-600">
                    {f.flags.map((flag) => `${flag} (${flagWords[flag] ?? flag})`).join(", ")}
                  </td>
                  <td className="px-3 py-2">
                    {f.reductionId ? (
                      <Link
                        to={`/projects/${projectId}/reductions/${f.reductionId}`}
                        className="text-brand-700 hover:underline"
                      >
                        In review
                      </Link>
                    ) : canPropose ? (
                      <button
                        type="button"
                        disabled={propose.isPending}
                        onClick={() => propose.mutate(f.rank)}
                        className="rounded-md border border-slate-300 px-2 py-0.5 text-xs font-medium text-slate-700 hover:bg-slate-50 disabled:opacity-50"
                        data-testid="propose-finding"
                      >
                        Propose
                      </button>
                    ) : (
                      <span className="text-xs text-slate-500">not proposed</span>
                    )}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </section>
  );
}

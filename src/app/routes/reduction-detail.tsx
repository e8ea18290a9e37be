// One reduction: what it claims, the two wiring diagrams coloured by block, the encoding, the runs side by side,
// the certificate to download, and the review.
import { Link, useParams } from "react-router-dom";
import { can } from "@shared/types/roles";
import { Alert } from "@/components/ui/alert";
import { useReduction } from "@/features/reductions/api/get-reduction";
import { CodewordTable } from "@/features/reductions/components/codeword-table";
import { PairedTrajectories } from "@/features/reductions/components/paired-trajectories";
import { ReductionDiagrams } from "@/features/reductions/components/reduction-diagrams";
import { ReviewPanel } from "@/features/reductions/components/review-panel";
import { SaveTargetForm } from "@/features/reductions/components/save-target-form";
import { useProjectOutlet } from "./project-layout";

const notionText = {
  "block-emulation": "emulates",
  "dynamical-embedding": "embeds",
  "coarse-graining": "coarse-grains onto",
  "node-elimination": "reduces by node elimination to",
  "constant-percolation": "reduces by percolation of constants to",
} as const;

export function ReductionDetailRoute() {
  const { projectId = "", reductionId = "" } = useParams();
  const { project } = useProjectOutlet();
  const { data: r, error, isPending } = useReduction(projectId, reductionId);
  if (isPending) return <p className="text-sm text-slate-500">Loading the reduction…</p>;
  if (error || !r) return <Alert>{error?.message ?? "No such reduction"}</Alert>;
  const isSubstitution = r.notion === "node-elimination" || r.notion === "constant-percolation";
  const targetLabel = r.target
    ? `${r.target.modelName} (revision ${r.target.revision})`
    : `a ${r.targetNodeCount}-node network (${r.targetNames.join(", ")})`;

  return (
    <article className="space-y-6" data-testid="reduction-detail">
      <header className="space-y-1">
        <Link to={`/projects/${projectId}/reductions`} className="text-sm text-brand-700 hover:underline">
          ← All reductions
        </Link>
        <h2 className="text-xl font-semibold text-slate-900">
          {r.source.modelName} <span className="text-slate-500">(revision {r.source.revision})</span>{" "}
          {notionText[r.notion]} {targetLabel}
          {r.timeScale > 1 && <span className="text-slate-500"> at time scale t = {r.timeScale}</span>}
        </h2>
        {r.flags.length > 0 && <p className="text-sm text-amber-700">Flags: {r.flags.join(", ")}</p>}
        <p className="text-xs text-slate-500">
          A reduction is a statement about the model, not about the cell it describes.
        </p>
      </header>
      {!r.target && can(project.role, project.siteRole, "model:write") && (
        <SaveTargetForm
          projectId={projectId}
          reductionId={r.id}
          suggestedName={`${r.source.modelName}: ${r.targetNodeCount}-node reduction`}
        />
      )}
      <ReductionDiagrams certificate={r.certificate} />
      <section className="space-y-2">
        <h3 className="font-semibold text-slate-800">{isSubstitution ? "What was removed" : "Encoding"}</h3>
        <CodewordTable certificate={r.certificate} />
      </section>
      {/* Elimination and percolation state which attractors correspond, not a step-by-step simulation. */}
      {!isSubstitution && (
        <section className="space-y-2">
          <h3 className="font-semibold text-slate-800">Runs side by side</h3>
          <PairedTrajectories certificate={r.certificate} />
        </section>
      )}
      <p>
        <a
          href={`/api/projects/${projectId}/reductions/${r.id}/certificate`}
          download
          className="text-sm font-medium text-brand-700 underline"
          data-testid="certificate-download"
        >
          Download the certificate (JSON)
        </a>{" "}
        <span className="text-xs text-slate-500">
          Check it anywhere with <code>npm run -s emulant -- verify certificate.json</code>.
        </span>
      </p>
      <ReviewPanel
        projectId={projectId}
        reduction={r}
        canDecide={can(project.role, project.siteRole, "review:decide")}
        canComment={can(project.role, project.siteRole, "comment:write")}
      />
    </article>
  );
}

// Download links for one revision: SBML-qual, rule text, truth-table CSV, and the original upload when there was one.
import { exportUrl, originalFileUrl } from "../api/export-links";

export function Downloads({
  projectId,
  modelId,
  revision,
  originalName,
}: {
  projectId: string;
  modelId: string;
  revision: number;
  originalName: string | null;
}) {
  const link =
    "rounded-md border border-slate-300 bg-white px-3 py-1.5 text-sm font-medium text-slate-700 hover:bg-slate-50";
  return (
    <div className="flex flex-wrap gap-2" data-testid="downloads">
      <a className={link} href={exportUrl(projectId, modelId, revision, "sbml")} download>
        SBML-qual
      </a>
      <a className={link} href={exportUrl(projectId, modelId, revision, "rules")} download>
        Rule text
      </a>
      <a className={link} href={exportUrl(projectId, modelId, revision, "csv")} download>
        Truth tables (CSV)
      </a>
      {originalName && (
        <a className={link} href={originalFileUrl(projectId, modelId, revision)} download>
          Original file ({originalName})
        </a>
      )}
    </div>
  );
}

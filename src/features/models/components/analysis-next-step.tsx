// The model page's one clear next step: which analyses fit this model's size and why, then the run views for SAT,
// trap spaces and asynchronous attractors, the recommended ones first and marked.
import { nextStepFor, METHOD_TEXT } from "../lib/analysis-methods";
import { AsyncAttractorsView } from "./async-attractors-view";
import { SatCyclesView } from "./sat-cycles-view";
import { TrapSpacesView } from "./trap-spaces-view";

export interface AnalysisNextStepProps {
  projectId: string;
  revisionId: string;
  nodeCount: number;
  fileBase: string;
  canStart: boolean;
}

// Only the first letter: a sentence keeps the acronyms in the titles ("SAT") as they are.
const inSentence = (title: string) => title.charAt(0).toLowerCase() + title.slice(1);

export function AnalysisNextStep({ projectId, revisionId, nodeCount, fileBase, canStart }: AnalysisNextStepProps) {
  const step = nextStepFor(nodeCount);
  const props = { projectId, revisionId, fileBase, canStart };
  const views = {
    "sat-cycles": <SatCyclesView key="sat" {...props} recommended={step.methods.includes("sat-cycles")} />,
    "trap-spaces": <TrapSpacesView key="trap" {...props} recommended={step.methods.includes("trap-spaces")} />,
    "async-attractors": (
      <AsyncAttractorsView key="async" {...props} recommended={step.methods.includes("async-attractors")} />
    ),
  };
  const order = (["sat-cycles", "trap-spaces", "async-attractors"] as const)
    .slice()
    .sort((a, b) => Number(step.methods.includes(b)) - Number(step.methods.includes(a)));
  return (
    <div className="space-y-3" data-testid="analysis-next-step">
      <p className="rounded-md bg-brand-50 p-3 text-sm text-slate-800" data-testid="next-step-text">
        <strong>Next step: {step.methods.map((m) => inSentence(METHOD_TEXT[m].title)).join(" and ")}.</strong>{" "}
        {step.reason}
      </p>
      {order.map((m) => views[m])}
    </div>
  );
}

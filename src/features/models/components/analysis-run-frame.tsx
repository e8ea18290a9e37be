// The frame every analysis run shares on the model page: the method's name, its limits, what it proves and does not,
// its parameters, start, progress, cancel, failure in words, and the result once there is one.
import type { ReactNode } from "react";
import type { Run } from "@shared/schemas/runs";
import { Button } from "@/components/ui/button";
import { RunProgress } from "@/features/runs";
import { METHOD_TEXT, type AnalysisMethod } from "../lib/analysis-methods";

export interface AnalysisRunFrameProps {
  method: AnalysisMethod;
  testId: string;
  /** The recommended next step gets the primary button. */
  recommended: boolean;
  canStart: boolean;
  startLabel: string;
  parameters?: ReactNode;
  analysis: {
    run: Run | null;
    isLive: boolean;
    startError: Error | null;
    isStarting: boolean;
    isCancelling: boolean;
    cancel(): void;
  };
  onStart(): void;
  children?: ReactNode;
}

export function AnalysisRunFrame({
  method,
  testId,
  recommended,
  canStart,
  startLabel,
  parameters,
  analysis,
  onStart,
  children,
}: AnalysisRunFrameProps) {
  const text = METHOD_TEXT[method];
  const { run } = analysis;
  return (
    <div data-testid={testId} className="space-y-3 rounded-md border border-slate-200 p-3 text-sm">
      <div>
        <h4 className="font-semibold text-slate-900">
          {text.title}
          {recommended && (
            <span className="ml-2 rounded bg-brand-700 px-1.5 py-0.5 text-xs font-medium text-white">next step</span>
          )}
        </h4>
        <dl className="mt-1 grid gap-x-3 gap-y-0.5 text-xs text-slate-600 sm:grid-cols-[auto_1fr]">
          <dt className="font-medium">Limits</dt>
          <dd>{text.limit}</dd>
          <dt className="font-medium">Proves</dt>
          <dd>{text.proves}</dd>
          <dt className="font-medium">Does not prove</dt>
          <dd>{text.doesNotProve}</dd>
        </dl>
      </div>
      {canStart ? (
        <div className="flex flex-wrap items-end gap-3">
          {parameters}
          <Button
            variant={recommended ? "primary" : "secondary"}
            data-testid={`${testId}-start`}
            disabled={analysis.isStarting || analysis.isLive}
            onClick={onStart}
          >
            {startLabel}
          </Button>
        </div>
      ) : (
        !run && <p className="text-slate-600">Ask a modeler or the project owner to start it.</p>
      )}
      {analysis.startError && (
        <p role="alert" className="text-red-700">
          {analysis.startError.message}
        </p>
      )}
      {run && analysis.isLive && (
        <div className="space-y-2">
          <RunProgress run={run} label={`${text.title} progress`} />
          {canStart && (
            <Button variant="secondary" size="sm" disabled={analysis.isCancelling} onClick={analysis.cancel}>
              Cancel
            </Button>
          )}
        </div>
      )}
      {run?.state === "failed" && (
        <p role="alert" className="text-red-700">
          The run failed: {run.error?.message ?? "unknown error"}
        </p>
      )}
      {run?.state === "succeeded" && children}
    </div>
  );
}

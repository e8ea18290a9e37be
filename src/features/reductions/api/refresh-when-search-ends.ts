// A search's reductions are written when its run succeeds, so the project's reduction lists and hierarchy go stale at
// that moment: this refetches them once when a followed search run goes from unfinished to finished.
import { useQueryClient } from "@tanstack/react-query";
import { useEffect, useRef } from "react";
import { isRunFinished, type Run } from "@shared/schemas/runs";
import { reductionKeys } from "./keys";

export function useRefreshWhenSearchEnds(run: Run | undefined) {
  const qc = useQueryClient();
  const wasRunning = useRef(false);
  useEffect(() => {
    if (!run || run.kind !== "reduction-search") return;
    if (!isRunFinished(run.state)) wasRunning.current = true;
    else if (wasRunning.current) {
      wasRunning.current = false;
      void qc.invalidateQueries({ queryKey: reductionKeys.project(run.projectId) });
    }
  }, [qc, run]);
}

// Cancel, retry and delete for one run; shown only to roles that may start runs.
import { useNavigate } from "react-router-dom";
import { isRunFinished, type Run } from "@shared/schemas/runs";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { useCancelRun } from "../api/cancel-run";
import { useDeleteRun } from "../api/delete-run";
import { useRetryRun } from "../api/retry-run";

export function RunActions({ run }: { run: Run }) {
  const navigate = useNavigate();
  const cancel = useCancelRun();
  const retry = useRetryRun();
  const remove = useDeleteRun();
  const error = cancel.error ?? retry.error ?? remove.error;
  const onDelete = () => {
    if (!window.confirm("Delete this run and its stored result?")) return;
    remove.mutate(run, { onSuccess: () => navigate(`/projects/${run.projectId}/runs`) });
  };
  return (
    <div className="space-y-2">
      <div className="flex flex-wrap gap-2">
        {!isRunFinished(run.state) && (
          <Button
            variant="secondary"
            onClick={() => cancel.mutate(run)}
            disabled={cancel.isPending}
            data-testid="cancel-run"
          >
            Cancel run
          </Button>
        )}
        {(run.state === "failed" || run.state === "cancelled") && (
          <Button onClick={() => retry.mutate(run)} disabled={retry.isPending} data-testid="retry-run">
            Retry
          </Button>
        )}
        <Button variant="danger" onClick={onDelete} disabled={remove.isPending} data-testid="delete-run">
          Delete
        </Button>
      </div>
      {error && <Alert>{error.message}</Alert>}
    </div>
  );
}

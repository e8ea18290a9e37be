// Leaving a page with unsaved edits asks first: the browser's own prompt for a reload or a closed tab, and a dialog
// for a move inside the app (React Router's blocker).
import { useEffect } from "react";
import { useBlocker } from "react-router-dom";
import { Button } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";

export function UnsavedChangesGuard({ when, what }: { when: boolean; what: string }) {
  const blocker = useBlocker(
    ({ currentLocation, nextLocation }) => when && currentLocation.pathname !== nextLocation.pathname,
  );
  useEffect(() => {
    if (!when) return;
    const warn = (e: BeforeUnloadEvent) => e.preventDefault();
    window.addEventListener("beforeunload", warn);
    return () => window.removeEventListener("beforeunload", warn);
  }, [when]);
  return (
    <Dialog open={blocker.state === "blocked"} title="Leave without saving?" onClose={() => blocker.reset?.()}>
      <p className="text-sm text-slate-700" data-testid="unsaved-warning">
        {what} are not saved. A draft is kept in this browser, so you can come back to them.
      </p>
      <div className="flex justify-end gap-2">
        <Button variant="secondary" onClick={() => blocker.reset?.()} data-testid="stay">
          Stay and keep editing
        </Button>
        <Button variant="danger" onClick={() => blocker.proceed?.()} data-testid="leave">
          Leave
        </Button>
      </div>
    </Dialog>
  );
}

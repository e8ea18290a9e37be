// The runs feature's public surface: the one client for /api/projects/:projectId/runs. Other features and the route
// modules import runs from here only (never from inside this folder), so every screen that shows a run shares one
// cache entry per run, one polling rule and one invalidation rule.
export { runKeys, type RunFilter } from "./api/keys";
export { storeRun, forgetRun } from "./api/run-cache";
export { runQuery, useRun } from "./api/get-run";
export { runListQuery, useRunList } from "./api/list-runs";
export { useStartRun, type StartRunInput } from "./api/start-run";
export { useCancelRun } from "./api/cancel-run";
export { useRetryRun } from "./api/retry-run";
export { useDeleteRun } from "./api/delete-run";
export { NotificationBell } from "./components/notification-bell";
export { NotificationSettings } from "./components/notification-settings";
export { RecentNotifications } from "./components/recent-notifications";
export { RunActions } from "./components/run-actions";
export { RunFilters } from "./components/run-filters";
export { RunProgress } from "./components/run-progress";
export { RunStateBadge } from "./components/run-state-badge";
export { RunsTable } from "./components/runs-table";
export { StartRunForm } from "./components/start-run-form";
export { RunResultView } from "./components/run-result-view";
export { runTitle, nothingFoundSentence } from "./lib/run-title";

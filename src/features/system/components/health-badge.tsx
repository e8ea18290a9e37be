// The footer's status: whether the server and its database answer (polled through the health endpoint).
import { useHealth } from "../api/get-health";

export function HealthBadge() {
  const { data, isError } = useHealth();
  const up = data?.database.status === "up";
  const label = isError ? "server unreachable" : !data ? "checking…" : up ? "database up" : "database down";
  return (
    <span
      data-testid="health-badge"
      data-status={isError ? "error" : (data?.database.status ?? "pending")}
      className="inline-flex items-center gap-1.5"
    >
      <span
        className={`h-2 w-2 rounded-full ${up ? "bg-emerald-500" : isError || data ? "bg-red-500" : "bg-slate-300"}`}
      />
      {label}
    </span>
  );
}

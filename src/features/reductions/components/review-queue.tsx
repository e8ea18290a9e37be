// The reviewer's queue: filters (state, model, notion, target size, flags), a sort, and one decision for all the
// selected reductions. Rejecting needs a reason, because the person who proposed them reads it.
import { useState } from "react";
import type { ReductionNotion, ReductionSort, ReviewState } from "@shared/schemas/reductions";
import { ApiError } from "@/lib/api-client";
import { plural } from "@/lib/plural";
import { useDecideReductions } from "../api/decide-reductions";
import type { ReductionFilter } from "../api/keys";
import { useReductions } from "../api/list-reductions";
import { ReductionsTable } from "./reductions-table";

const selectClass = "rounded-md border border-slate-300 bg-white px-2 py-1 text-sm";
const sizes = [1, 2, 3, 4, 5, 6, 8, 10, 12, 16, 20];

function Select<T extends string>({
  label,
  value,
  options,
  onChange,
}: {
  label: string;
  value: T | "";
  options: { value: T | ""; label: string }[];
  onChange: (v: T | "") => void;
}) {
  return (
    <label className="flex flex-col gap-1 text-xs font-medium text-slate-600">
      {label}
      <select className={selectClass} value={value} onChange={(e) => onChange(e.target.value as T | "")}>
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </label>
  );
}

export function ReviewQueue({
  projectId,
  models,
  canDecide,
}: {
  projectId: string;
  models: { id: string; name: string }[];
  canDecide: boolean;
}) {
  const [filter, setFilter] = useState<ReductionFilter>({ state: canDecide ? "proposed" : undefined, sort: "newest" });
  const [selected, setSelected] = useState<Set<string>>(new Set());
  const [reason, setReason] = useState("");
  const reductions = useReductions(projectId, filter);
  const decide = useDecideReductions(projectId);
  const set = (patch: Partial<ReductionFilter>) => {
    setFilter((f) => ({ ...f, ...patch }));
    setSelected(new Set());
  };
  const shown = new Set((reductions.data ?? []).map((r) => r.id));
  const chosen = [...selected].filter((id) => shown.has(id));
  const sizeOptions = [
    { value: "" as const, label: "any" },
    ...sizes.map((n) => ({ value: String(n), label: String(n) })),
  ];
  const bulk = (decision: "approve" | "reject") =>
    decide.mutate(
      { decision, comment: reason, reductionIds: chosen },
      {
        onSuccess: () => {
          setSelected(new Set());
          setReason("");
        },
      },
    );

  return (
    <section className="space-y-3" aria-label="Review queue">
      <div className="flex flex-wrap items-end gap-3" data-testid="queue-filters">
        <Select<ReviewState>
          label="Review state"
          value={filter.state ?? ""}
          options={[
            { value: "", label: "all" },
            { value: "proposed", label: "waiting for review" },
            { value: "approved", label: "approved" },
            { value: "rejected", label: "rejected" },
          ]}
          onChange={(v) => set({ state: v || undefined })}
        />
        <Select<string>
          label="Source model"
          value={filter.sourceModelId ?? ""}
          options={[{ value: "", label: "all models" }, ...models.map((m) => ({ value: m.id, label: m.name }))]}
          onChange={(v) => set({ sourceModelId: v || undefined })}
        />
        <Select<ReductionNotion>
          label="Notion"
          value={filter.notion ?? ""}
          options={[
            { value: "", label: "all notions" },
            { value: "block-emulation", label: "block emulation" },
            { value: "dynamical-embedding", label: "dynamical embedding" },
            { value: "coarse-graining", label: "coarse-graining" },
            { value: "node-elimination", label: "node elimination" },
            { value: "constant-percolation", label: "percolation of constants" },
          ]}
          onChange={(v) => set({ notion: v || undefined })}
        />
        <Select<string>
          label="Target nodes, at least"
          value={filter.minTargetNodes ? String(filter.minTargetNodes) : ""}
          options={sizeOptions}
          onChange={(v) => set({ minTargetNodes: v ? Number(v) : undefined })}
        />
        <Select<string>
          label="at most"
          value={filter.maxTargetNodes ? String(filter.maxTargetNodes) : ""}
          options={sizeOptions}
          onChange={(v) => set({ maxTargetNodes: v ? Number(v) : undefined })}
        />
        <Select<NonNullable<ReductionFilter["flag"]>>
          label="Flags"
          value={filter.flag ?? ""}
          options={[
            { value: "", label: "any" },
            { value: "none", label: "no flag" },
            { value: "isomorphic", label: "isomorphic" },
            { value: "trivial", label: "trivial" },
            { value: "constant", label: "constant" },
            { value: "identity", label: "identity" },
            { value: "decoupled", label: "decoupled" },
          ]}
          onChange={(v) => set({ flag: v || undefined })}
        />
        <Select<ReductionSort>
          label="Sort"
          value={filter.sort ?? "newest"}
          options={[
            { value: "newest", label: "newest first" },
            { value: "oldest", label: "oldest first" },
            { value: "smallest", label: "smallest target first" },
            { value: "largest", label: "largest target first" },
            { value: "rank", label: "search rank" },
          ]}
          onChange={(v) => set({ sort: v || "newest" })}
        />
      </div>
      {canDecide && reductions.data && reductions.data.length > 0 && (
        <div className="space-y-2 rounded-md border border-slate-200 bg-slate-50 p-3" data-testid="bulk-actions">
          <p className="text-sm text-slate-700" data-testid="selected-count">
            {plural(chosen.length, "reduction")} selected
          </p>
          <textarea
            value={reason}
            onChange={(e) => setReason(e.target.value)}
            maxLength={4000}
            rows={2}
            placeholder="Reason (recorded with each decision; needed to reject)"
            className="w-full rounded-md border border-slate-300 px-2 py-1 text-sm"
            data-testid="bulk-reason"
          />
          <div className="flex flex-wrap gap-2">
            <button
              type="button"
              disabled={decide.isPending || chosen.length === 0}
              onClick={() => bulk("approve")}
              className="rounded-md bg-emerald-700 px-3 py-1.5 text-sm font-medium text-white hover:bg-emerald-800 disabled:opacity-50"
              data-testid="bulk-approve"
            >
              Approve selected
            </button>
            <button
              type="button"
              disabled={decide.isPending || chosen.length === 0 || reason.trim() === ""}
              title={reason.trim() === "" ? "Write the reason first" : undefined}
              onClick={() => bulk("reject")}
              className="rounded-md bg-red-700 px-3 py-1.5 text-sm font-medium text-white hover:bg-red-800 disabled:opacity-50"
              data-testid="bulk-reject"
            >
              Reject selected
            </button>
          </div>
        </div>
      )}
      {decide.data && (
        <p className="text-sm text-slate-700" role="status" data-testid="bulk-outcome">
          {plural(decide.data.decided.length, "reduction")} decided
          {decide.data.skipped.length > 0 &&
            `; ${plural(decide.data.skipped.length, "was", "were")} left as they were: ${decide.data.skipped.map((s) => s.reason).join("; ")}`}
          .
        </p>
      )}
      {decide.error && (
        <p role="alert" className="rounded-md bg-red-50 px-3 py-2 text-sm text-red-800">
          {decide.error instanceof ApiError ? decide.error.message : "The request failed"}
        </p>
      )}
      {reductions.error && (
        <p role="alert" className="text-sm text-red-800">
          {reductions.error.message}
        </p>
      )}
      {reductions.data && (
        <ReductionsTable
          projectId={projectId}
          reductions={reductions.data}
          selection={
            canDecide
              ? {
                  selected,
                  toggle: (id) =>
                    setSelected((s) => {
                      const next = new Set(s);
                      if (next.has(id)) next.delete(id);
                      else next.add(id);
                      return next;
                    }),
                  setAll: (ids) => setSelected(new Set(ids)),
                }
              : undefined
          }
        />
      )}
    </section>
  );
}

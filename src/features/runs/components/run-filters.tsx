import { RUN_KINDS, RUN_STATES } from "@shared/schemas/runs";
import type { RunFilter } from "../api/keys";

const selectClass = "rounded-md border border-slate-300 bg-white px-2 py-1.5 text-sm";

export function RunFilters({ value, onChange }: { value: RunFilter; onChange(next: RunFilter): void }) {
  return (
    <div className="flex flex-wrap items-center gap-3 text-sm">
      <label className="flex items-center gap-2">
        <span className="text-slate-600">Kind</span>
        <select
          className={selectClass}
          value={value.kind ?? ""}
          onChange={(e) => onChange({ ...value, kind: e.target.value || undefined })}
          data-testid="filter-kind"
        >
          <option value="">All kinds</option>
          {RUN_KINDS.map((k) => (
            <option key={k} value={k}>
              {k}
            </option>
          ))}
        </select>
      </label>
      <label className="flex items-center gap-2">
        <span className="text-slate-600">State</span>
        <select
          className={selectClass}
          value={value.state ?? ""}
          onChange={(e) => onChange({ ...value, state: e.target.value || undefined })}
          data-testid="filter-state"
        >
          <option value="">All states</option>
          {RUN_STATES.map((s) => (
            <option key={s} value={s}>
              {s}
            </option>
          ))}
        </select>
      </label>
    </div>
  );
}

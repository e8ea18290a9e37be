// The controls above the graph: which stored hierarchy, the block-size range drawn, rules or symmetry classes,
// and a rule to find.
export interface HierarchyFilterValues {
  minBlock: number;
  maxBlock: number;
  bySymmetryClass: boolean;
  search: string;
}

export interface HierarchyFiltersProps {
  values: HierarchyFilterValues;
  largestBlock: number;
  onChange(values: HierarchyFilterValues): void;
  searchError: string | null;
}

const inputClass =
  "w-20 rounded-md border border-slate-300 px-2 py-1 text-sm focus:border-brand-600 focus:outline-none focus:ring-1 focus:ring-brand-600";

export function HierarchyFilters({ values, largestBlock, onChange, searchError }: HierarchyFiltersProps) {
  const blocks = Array.from({ length: largestBlock }, (_, i) => i + 1);
  return (
    <form
      className="flex flex-wrap items-end gap-4"
      onSubmit={(e) => e.preventDefault()}
      aria-label="Hierarchy filters"
    >
      <label className="flex flex-col gap-1 text-sm text-slate-700">
        Least block size from
        <select
          className={inputClass}
          value={values.minBlock}
          data-testid="filter-min-block"
          onChange={(e) => {
            const v = Number(e.target.value);
            onChange({ ...values, minBlock: v, maxBlock: Math.max(v, values.maxBlock) });
          }}
        >
          {blocks.map((b) => (
            <option key={b} value={b}>
              {b}
            </option>
          ))}
        </select>
      </label>
      <label className="flex flex-col gap-1 text-sm text-slate-700">
        to
        <select
          className={inputClass}
          value={values.maxBlock}
          data-testid="filter-max-block"
          onChange={(e) => {
            const v = Number(e.target.value);
            onChange({ ...values, maxBlock: v, minBlock: Math.min(v, values.minBlock) });
          }}
        >
          {blocks.map((b) => (
            <option key={b} value={b}>
              {b}
            </option>
          ))}
        </select>
      </label>
      <label className="flex items-center gap-2 pb-1 text-sm text-slate-700">
        <input
          type="checkbox"
          className="h-4 w-4 accent-brand-700"
          checked={values.bySymmetryClass}
          data-testid="filter-symmetry"
          onChange={(e) => onChange({ ...values, bySymmetryClass: e.target.checked })}
        />
        One node per symmetry class (reflection, complement)
      </label>
      <label className="flex flex-col gap-1 text-sm text-slate-700">
        Find a rule
        <input
          className={inputClass}
          inputMode="numeric"
          placeholder="e.g. 110"
          value={values.search}
          data-testid="filter-search"
          aria-invalid={searchError !== null}
          onChange={(e) => onChange({ ...values, search: e.target.value })}
        />
      </label>
      {searchError && (
        <p className="pb-1 text-sm text-red-700" role="alert">
          {searchError}
        </p>
      )}
    </form>
  );
}

// The caller's projects as a table with search, sortable columns and paging (TanStack Table v9, client-side:
// a person's project list is small enough to hold in the browser).
import {
  columnFilteringFeature,
  createColumnHelper,
  createFilteredRowModel,
  createPaginatedRowModel,
  createSortedRowModel,
  filterFn_includesString,
  globalFilteringFeature,
  rowPaginationFeature,
  rowSortingFeature,
  sortFn_alphanumeric,
  sortFn_datetime,
  sortFn_text,
  tableFeatures,
  useTable,
  type PaginationState,
  type SortingState,
} from "@tanstack/react-table";
import { useState } from "react";
import { Link } from "react-router-dom";
import type { ProjectListItem } from "@shared/schemas/projects";
import { Button } from "@/components/ui/button";

const features = tableFeatures({
  rowSortingFeature,
  rowPaginationFeature,
  columnFilteringFeature,
  globalFilteringFeature,
  sortedRowModel: createSortedRowModel(),
  filteredRowModel: createFilteredRowModel(),
  paginatedRowModel: createPaginatedRowModel(),
  sortFns: { text: sortFn_text, alphanumeric: sortFn_alphanumeric, datetime: sortFn_datetime },
  filterFns: { includesString: filterFn_includesString },
});

const column = createColumnHelper<typeof features, ProjectListItem>();

const roleLabel = (role: ProjectListItem["role"]) => (role ? role[0]!.toUpperCase() + role.slice(1) : "Site admin");

const columns = column.columns([
  column.accessor("name", {
    header: "Name",
    sortFn: "text",
    cell: (info) => (
      <Link to={`/projects/${info.row.original.id}`} className="font-medium text-brand-700 hover:underline">
        {info.getValue()}
      </Link>
    ),
  }),
  column.accessor((p) => roleLabel(p.role), { id: "role", header: "Your role", sortFn: "text" }),
  column.accessor("memberCount", { header: "Members", sortFn: "alphanumeric", enableGlobalFilter: false }),
  column.accessor((p) => (p.archived ? "Archived" : "Active"), { id: "status", header: "Status", sortFn: "text" }),
  column.accessor((p) => new Date(p.updatedAt), {
    id: "updatedAt",
    header: "Last change",
    sortFn: "datetime",
    enableGlobalFilter: false,
    cell: (info) => <time dateTime={info.row.original.updatedAt}>{info.getValue().toLocaleDateString()}</time>,
  }),
]);

export function ProjectsTable({ projects }: { projects: ProjectListItem[] }) {
  const [sorting, setSorting] = useState<SortingState>([{ id: "name", desc: false }]);
  const [pagination, setPagination] = useState<PaginationState>({ pageIndex: 0, pageSize: 10 });
  const [globalFilter, setGlobalFilter] = useState("");
  const table = useTable({
    features,
    columns,
    data: projects,
    state: { sorting, pagination, globalFilter },
    onSortingChange: setSorting,
    onPaginationChange: setPagination,
    onGlobalFilterChange: setGlobalFilter,
    globalFilterFn: "includesString",
  });
  const rows = table.getRowModel().rows;
  const matching = table.getFilteredRowModel().rows.length;
  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-center gap-3">
        <label className="flex-1">
          <span className="sr-only">Search projects</span>
          <input
            type="search"
            value={globalFilter}
            onChange={(e) => {
              setGlobalFilter(e.target.value);
              setPagination((p) => ({ ...p, pageIndex: 0 }));
            }}
            placeholder="Search by name, role or status"
            className="w-full max-w-sm rounded-md border border-slate-300 px-3 py-2 text-sm shadow-sm focus:outline-none focus:ring-2 focus:ring-brand-600"
            data-testid="project-search"
          />
        </label>
        <span className="text-sm text-slate-600">
          {matching} of {projects.length} project{projects.length === 1 ? "" : "s"}
        </span>
      </div>
      <div className="overflow-x-auto rounded-lg border border-slate-200 bg-white">
        <table className="min-w-full divide-y divide-slate-200 text-sm" data-testid="projects-table">
          <thead className="bg-slate-50 text-left text-xs font-semibold uppercase tracking-wide text-slate-600">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const sorted = header.column.getIsSorted();
                  return (
                    <th
                      key={header.id}
                      className="px-4 py-2"
                      aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : "none"}
                    >
                      <button
                        type="button"
                        className="inline-flex items-center gap-1 uppercase hover:text-slate-900"
                        onClick={header.column.getToggleSortingHandler()}
                      >
                        <table.FlexRender header={header} />
                        <span aria-hidden className="text-slate-400">
                          {sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : "↕"}
                        </span>
                      </button>
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody className="divide-y divide-slate-100">
            {rows.map((row) => (
              <tr key={row.id} className="hover:bg-slate-50">
                {row.getAllCells().map((cell) => (
                  <td key={cell.id} className="px-4 py-2 text-slate-700">
                    <table.FlexRender cell={cell} />
                  </td>
                ))}
              </tr>
            ))}
            {rows.length === 0 && (
              <tr>
                <td colSpan={columns.length} className="px-4 py-6 text-center text-slate-500">
                  {projects.length === 0
                    ? "You are not in any project yet. Create one above."
                    : "No project matches your search."}
                </td>
              </tr>
            )}
          </tbody>
        </table>
      </div>
      {table.getPageCount() > 1 && (
        <div className="flex items-center justify-end gap-2 text-sm">
          <Button
            variant="secondary"
            size="sm"
            onClick={() => table.previousPage()}
            disabled={!table.getCanPreviousPage()}
          >
            Previous
          </Button>
          <span className="text-slate-600">
            Page {pagination.pageIndex + 1} of {table.getPageCount()}
          </span>
          <Button variant="secondary" size="sm" onClick={() => table.nextPage()} disabled={!table.getCanNextPage()}>
            Next
          </Button>
        </div>
      )}
    </div>
  );
}

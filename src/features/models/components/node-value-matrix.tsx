// Node values of several states or subspaces side by side: one row per node, one column per item, each cell 1 (on),
// 0 (off) or "free" (a node a trap space leaves free, or one that changes along an attractor). Columns beyond
// `maxColumns` are left to the JSON download and said so.
export interface MatrixColumn {
  label: string;
  /** One character per node: '0', '1' or '-'. */
  pattern: string;
}

const cell: Record<string, { text: string; className: string }> = {
  "1": { text: "1", className: "bg-brand-700 text-white" },
  "0": { text: "0", className: "bg-slate-100 text-slate-700" },
  "-": { text: "free", className: "text-slate-400 italic" },
};

export function NodeValueMatrix({
  nodes,
  columns,
  caption,
  maxColumns = 12,
  testId,
}: {
  nodes: readonly string[];
  columns: MatrixColumn[];
  caption: string;
  maxColumns?: number;
  testId?: string;
}) {
  const shown = columns.slice(0, maxColumns);
  return (
    <div className="overflow-x-auto">
      <table className="text-xs" data-testid={testId}>
        <caption className="mb-1 text-left text-slate-600">
          {caption}
          {columns.length > shown.length &&
            ` The first ${shown.length} of ${columns.length} are shown; all are in the JSON.`}
        </caption>
        <thead>
          <tr>
            <th scope="col" className="px-2 py-1 text-left font-medium text-slate-600">
              Node
            </th>
            {shown.map((c) => (
              <th key={c.label} scope="col" className="px-2 py-1 font-medium text-slate-600">
                {c.label}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {nodes.map((node, i) => (
            <tr key={node} className="border-t border-slate-100">
              <th scope="row" className="px-2 py-0.5 text-left font-mono font-normal text-slate-800">
                {node}
              </th>
              {shown.map((c) => {
                const v = cell[c.pattern[i] ?? "-"]!;
                return (
                  <td key={c.label} className={`px-2 py-0.5 text-center font-mono ${v.className}`}>
                    {v.text}
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

/** Nodes fixed by a pattern, in words: "Rb = 0, p27 = 0" (or "none"). */
export function fixedInWords(nodes: readonly string[], pattern: string): string {
  const fixed = nodes.flatMap((n, i) => (pattern[i] === "-" ? [] : [`${n} = ${pattern[i]}`]));
  return fixed.length ? fixed.join(", ") : "none";
}

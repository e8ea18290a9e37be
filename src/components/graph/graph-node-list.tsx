// The nodes of a graph as buttons, for keyboard and screen-reader users: Tab reaches each one, focusing it shows the
// node's neighbourhood in the picture, Enter or a click does what clicking the node does.
export interface ListedNode {
  id: string;
  label: string;
  /** Extra words read after the label, e.g. "3 regulators". */
  detail?: string;
}

export interface GraphNodeListProps {
  nodes: ListedNode[];
  /** What the list is, for assistive technology: "Nodes of the wiring diagram". */
  label: string;
  /** What activating a node does, shown once above the list: "Enter opens the model". */
  hint: string;
  activeId?: string | null;
  onFocusNode(id: string | null): void;
  onActivate(id: string): void;
  testId?: string;
}

export function GraphNodeList({ nodes, label, hint, activeId, onFocusNode, onActivate, testId }: GraphNodeListProps) {
  return (
    <div className="space-y-1">
      <p className="text-xs text-slate-500">{hint}</p>
      <ul
        aria-label={label}
        data-testid={testId}
        className="flex max-h-48 flex-wrap gap-1.5 overflow-y-auto p-0.5"
        onMouseLeave={() => onFocusNode(null)}
      >
        {nodes.map((n) => (
          <li key={n.id}>
            <button
              type="button"
              data-node-id={n.id}
              aria-pressed={activeId === n.id}
              aria-label={n.detail ? `${n.label}, ${n.detail}` : n.label}
              onFocus={() => onFocusNode(n.id)}
              onBlur={() => onFocusNode(null)}
              onMouseEnter={() => onFocusNode(n.id)}
              onClick={() => onActivate(n.id)}
              className={`rounded-md border px-2 py-0.5 text-xs font-medium focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-amber-600 ${
                activeId === n.id
                  ? "border-amber-600 bg-amber-50 text-amber-900"
                  : "border-slate-300 bg-white text-slate-700 hover:bg-slate-50"
              }`}
            >
              {n.label}
            </button>
          </li>
        ))}
      </ul>
    </div>
  );
}

// Rule text editor: a plain textarea over a mirrored backdrop that marks faulty lines and the column where reading
// stopped, with a line-number gutter and a live node count from the server's parser (debounced).
import { useEffect, useMemo, useRef, useState } from "react";
import type { ParseIssue } from "@shared/schemas/models";
import { useValidateRules } from "../api/validate-rules";
import { ParseErrorList } from "./parse-error-list";

function useDebounced<T>(value: T, ms: number): T {
  const [debounced, setDebounced] = useState(value);
  useEffect(() => {
    const id = setTimeout(() => setDebounced(value), ms);
    return () => clearTimeout(id);
  }, [value, ms]);
  return debounced;
}

export interface RuleEditorProps {
  projectId: string;
  value: string;
  onChange(value: string): void;
  /** Errors from a failed save, shown until the text changes. */
  serverErrors?: readonly ParseIssue[];
  rows?: number;
  /** Told whether the text may be saved: false while it has errors or its check has not answered yet. */
  onSavableChange?(savable: boolean): void;
}

const lineHeight = "1.5rem";

export function RuleEditor({
  projectId,
  value,
  onChange,
  serverErrors = [],
  rows = 16,
  onSavableChange,
}: RuleEditorProps) {
  const debounced = useDebounced(value, 300);
  const check = useValidateRules(projectId, debounced, debounced.trim().length > 0);
  const isCurrent = debounced === value && !check.isPlaceholderData;
  const errors = check.data && debounced.trim() ? check.data.errors : [];
  const shownErrors = errors.length ? errors : serverErrors;
  const savable = value.trim().length > 0 && isCurrent && Boolean(check.data) && errors.length === 0;
  useEffect(() => onSavableChange?.(savable), [savable, onSavableChange]);
  const backdrop = useRef<HTMLPreElement>(null);
  const gutter = useRef<HTMLDivElement>(null);
  const lines = value.split("\n");
  const byLine = useMemo(() => {
    const m = new Map<number, ParseIssue>();
    for (const e of shownErrors) if (!m.has(e.line)) m.set(e.line, e);
    return m;
  }, [shownErrors]);

  const syncScroll = (e: React.UIEvent<HTMLTextAreaElement>) => {
    if (backdrop.current) {
      backdrop.current.scrollTop = e.currentTarget.scrollTop;
      backdrop.current.scrollLeft = e.currentTarget.scrollLeft;
    }
    if (gutter.current) gutter.current.scrollTop = e.currentTarget.scrollTop;
  };

  return (
    <div className="space-y-2">
      <div
        className="flex overflow-hidden rounded-md border border-slate-300 bg-white focus-within:ring-2 focus-within:ring-brand-600"
        style={{ height: `calc(${rows} * ${lineHeight} + 1rem)` }}
      >
        <div
          ref={gutter}
          aria-hidden
          className="select-none overflow-hidden border-r border-slate-200 bg-slate-50 py-2 text-right font-mono text-xs text-slate-400"
        >
          {lines.map((_, i) => (
            <div
              key={i}
              style={{ height: lineHeight, lineHeight }}
              className={`px-2 ${byLine.has(i + 1) ? "bg-red-100 font-semibold text-red-700" : ""}`}
              title={byLine.get(i + 1)?.message}
            >
              {i + 1}
            </div>
          ))}
        </div>
        <div className="relative flex-1">
          <pre
            ref={backdrop}
            aria-hidden
            className="pointer-events-none absolute inset-0 m-0 overflow-hidden whitespace-pre px-3 py-2 font-mono text-sm text-transparent"
          >
            {lines.map((line, i) => {
              const issue = byLine.get(i + 1);
              if (!issue)
                return (
                  <div key={i} style={{ height: lineHeight, lineHeight }}>
                    {line || " "}
                  </div>
                );
              const col = Math.max(0, issue.column - 1);
              return (
                <div
                  key={i}
                  style={{ height: lineHeight, lineHeight }}
                  className="bg-red-50"
                  data-testid="editor-error-line"
                  data-line={i + 1}
                >
                  {line.slice(0, col)}
                  <span className="rounded-sm bg-red-300/70 underline decoration-red-600 decoration-wavy">
                    {line.slice(col, col + 1) || " "}
                  </span>
                  {line.slice(col + 1)}
                </div>
              );
            })}
          </pre>
          <textarea
            aria-label="Rule text"
            data-testid="rule-editor"
            spellCheck={false}
            value={value}
            onChange={(e) => onChange(e.target.value)}
            onScroll={syncScroll}
            wrap="off"
            className="absolute inset-0 h-full w-full resize-none overflow-auto bg-transparent px-3 py-2 font-mono text-sm text-slate-900 caret-slate-900 outline-none"
            style={{ lineHeight }}
          />
        </div>
      </div>
      <div className="flex items-center justify-between text-xs text-slate-600">
        <span data-testid="live-node-count">
          {check.data ? `${check.data.nodeCount} node${check.data.nodeCount === 1 ? "" : "s"}` : "—"}
          {!isCurrent && check.isFetching ? " · checking…" : ""}
        </span>
        <span>
          One rule per line: <code className="font-mono">Target' = expression</code> with <code>&amp; | ! ^</code>, or{" "}
          <code className="font-mono">threshold(+1 A, -1 B; tie keep)</code>; <code>#</code> starts a comment.
        </span>
      </div>
      <ParseErrorList
        errors={shownErrors}
        title={shownErrors.length === 1 ? "1 problem" : `${shownErrors.length} problems`}
      />
    </div>
  );
}

// A result's JSON as a file to download: the page shows the result in words and tables, the JSON is for tools.
import { useMemo } from "react";

export function JsonDownload({ data, fileName }: { data: unknown; fileName: string }) {
  const href = useMemo(
    () => `data:application/json;charset=utf-8,${encodeURIComponent(JSON.stringify(data, null, 2))}`,
    [data],
  );
  return (
    <a
      href={href}
      download={fileName}
      data-testid="json-download"
      className="inline-flex rounded-md border border-slate-300 px-2.5 py-1 text-xs font-medium text-slate-700 hover:border-brand-600"
    >
      Download JSON
    </a>
  );
}

// The encoding and the eight rows of the definition, as the server's independent verifier checked them.
import type { WitnessReport } from "@shared/schemas/automata";
import { plural } from "@/lib/plural";

function Word({ text, k }: { text: string; k: number }) {
  // codeword boundaries in a 3k-cell input are easier to read with a thin gap
  const parts = text.length === 3 * k ? [text.slice(0, k), text.slice(k, 2 * k), text.slice(2 * k)] : [text];
  return (
    <span className="font-mono text-xs">
      {parts.map((p, i) => (
        <span key={i} className={i === 1 ? "text-brand-700" : undefined}>
          {p}
          {i < parts.length - 1 ? " " : ""}
        </span>
      ))}
    </span>
  );
}

export function WitnessChecks({ report }: { report: WitnessReport }) {
  const k = report.witness.encoding["0"].length;
  return (
    <div className="space-y-2" data-testid="witness-checks">
      <p className="text-sm text-slate-700">
        Block size <strong>{report.minBlock}</strong>, time scale <strong>{report.witness.time}</strong>: 0 is encoded
        as <code className="rounded bg-slate-100 px-1 font-mono">{report.witness.encoding["0"]}</code>, 1 as{" "}
        <code className="rounded bg-slate-100 px-1 font-mono">{report.witness.encoding["1"]}</code>.{" "}
        <span
          className={report.verified ? "font-medium text-brand-700" : "font-medium text-red-700"}
          data-testid="witness-verdict"
        >
          {report.verified ? "The independent verifier confirms it." : "The independent verifier rejects it."}
        </span>
      </p>
      <div className="overflow-x-auto">
        <table className="min-w-full text-left text-sm">
          <thead className="text-xs text-slate-500">
            <tr>
              <th className="py-1 pr-4">a b c</th>
              <th className="py-1 pr-4">G(a,b,c)</th>
              <th className="py-1 pr-4">
                u<sub>a</sub> u<sub>b</sub> u<sub>c</sub>
              </th>
              <th className="py-1 pr-4">
                middle after {plural(report.witness.time, "step")} of rule {report.source}
              </th>
              <th className="py-1">agrees</th>
            </tr>
          </thead>
          <tbody className="divide-y divide-slate-100">
            {report.checks.map((c) => (
              <tr key={c.neighbourhood}>
                <td className="py-1 pr-4 font-mono">{c.neighbourhood.split("").join(" ")}</td>
                <td className="py-1 pr-4 font-mono">{c.expectedBit}</td>
                <td className="py-1 pr-4">
                  <Word text={c.input} k={k} />
                </td>
                <td className="py-1 pr-4">
                  <Word text={c.obtained} k={k} />
                </td>
                <td className={`py-1 ${c.agrees ? "text-brand-700" : "text-red-700"}`}>
                  {c.agrees ? "yes" : `no (expected ${c.expected})`}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}

// The encoding in words: per target node, its block and two codewords; then the context. For an embedding, the
// state map; for a coarse-graining, each observable's inputs, what it means in words, and its truth table. Wide
// tables scroll inside their own box, so the page itself fits a phone.
import type { Certificate } from "@shared/schemas/reductions";
import { BLOCK_COLOURS, observableInWords } from "../lib/certificate-view";

const cellClass = "border-b border-slate-100 px-3 py-1.5 text-left";

export function CodewordTable({ certificate }: { certificate: Certificate }) {
  if (certificate.notion === "node-elimination")
    return (
      <div className="space-y-1 text-sm text-slate-700" data-testid="eliminated-order">
        <p>Eliminated in this order, each function substituted into the nodes it regulated:</p>
        <ol className="list-decimal pl-5">
          {certificate.witness.eliminated.map((name) => (
            <li key={name}>{name}</li>
          ))}
        </ol>
      </div>
    );
  if (certificate.notion === "constant-percolation") {
    const held = certificate.witness.held;
    return (
      <div className="overflow-x-auto">
        <table className="min-w-full text-sm" data-testid="fixed-values-table">
          <thead className="bg-slate-50 text-xs uppercase text-slate-500">
            <tr>
              <th className={cellClass}>Fixed node</th>
              <th className={cellClass}>Value</th>
              <th className={cellClass}>Why</th>
            </tr>
          </thead>
          <tbody>
            {Object.entries(certificate.witness.fixed).map(([name, value]) => (
              <tr key={name}>
                <td className={cellClass}>{name}</td>
                <td className={`${cellClass} font-mono`}>{value}</td>
                <td className={cellClass}>{Object.hasOwn(held, name) ? "held" : "forced"}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    );
  }
  if (certificate.notion === "block-emulation") {
    const context = Object.entries(certificate.witness.context);
    return (
      <div className="space-y-3">
        <div className="overflow-x-auto">
          <table className="min-w-full text-sm" data-testid="codeword-table">
            <thead className="bg-slate-50 text-xs uppercase text-slate-500">
              <tr>
                <th className={cellClass}>Target node</th>
                <th className={cellClass}>Block (source nodes)</th>
                <th className={cellClass}>Codeword for 0</th>
                <th className={cellClass}>Codeword for 1</th>
              </tr>
            </thead>
            <tbody>
              {certificate.witness.blocks.map((b, j) => (
                <tr key={b.target}>
                  <td className={cellClass}>
                    <span
                      className="mr-2 inline-block h-3 w-3 rounded-full align-middle"
                      style={{ background: BLOCK_COLOURS[j % BLOCK_COLOURS.length] }}
                    />
                    {b.target}
                  </td>
                  <td className={cellClass}>{b.nodes.join(", ")}</td>
                  <td className={`${cellClass} font-mono`}>{b.zero}</td>
                  <td className={`${cellClass} font-mono`}>{b.one}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        <p className="text-sm text-slate-600">
          {context.length === 0 ? (
            "No context: every source node belongs to a block."
          ) : (
            <>Context (fixed values): {context.map(([n, v]) => `${n} = ${v}`).join(", ")}</>
          )}
        </p>
      </div>
    );
  }
  if (certificate.notion === "dynamical-embedding") {
    return (
      <div className="overflow-x-auto">
        <table className="min-w-full text-sm" data-testid="codeword-table">
          <thead className="bg-slate-50 text-xs uppercase text-slate-500">
            <tr>
              <th className={cellClass}>Target state</th>
              <th className={cellClass}>Source state</th>
            </tr>
          </thead>
          <tbody>
            {Object.entries(certificate.witness.map).map(([x, y]) => (
              <tr key={x}>
                <td className={`${cellClass} font-mono`}>{x}</td>
                <td className={`${cellClass} font-mono`}>{y}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    );
  }
  return (
    <div className="overflow-x-auto">
      <table className="min-w-full text-sm" data-testid="codeword-table">
        <thead className="bg-slate-50 text-xs uppercase text-slate-500">
          <tr>
            <th className={cellClass}>Target node</th>
            <th className={cellClass}>Observes</th>
            <th className={cellClass}>In words</th>
            <th className={cellClass}>Truth table (row = inputs as bits, first input lowest)</th>
          </tr>
        </thead>
        <tbody>
          {certificate.witness.observables.map((o) => (
            <tr key={o.target}>
              <td className={cellClass}>{o.target}</td>
              <td className={cellClass}>{o.inputs.join(", ")}</td>
              <td className={cellClass}>{observableInWords(o)}</td>
              <td className={`${cellClass} font-mono`}>{o.table}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

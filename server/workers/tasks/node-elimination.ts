// Rule text in, the reduced model out: node elimination (named nodes or every eligible one) or percolation of
// constants, with the certificate the independent verifier re-checks. Engine refusals (an unknown or self-regulated
// node, an elimination past the regulator limit) end the run with the engine's message.
import { eliminationCertificate, percolationCertificate } from "@shared/engine/certificates";
import { eligibleNodes, eliminateNodes, percolateConstants } from "@shared/engine/elimination";
import { compileDefinition, networkToDefinition, printRuleText, readRuleText } from "@shared/engine/rules";
import { nodeEliminationTask, type NodeEliminationResult } from "@shared/schemas/run-tasks";
import { shardTask } from "../task-context";

/** The certificate format's largest network (shared/schemas/reductions.ts). */
const MAX_CERTIFICATE_NODES = 2000;
/**
 * Most truth-table rows a stored certificate's reduced network may hold (one character each in the JSON): beyond it
 * the run's result and the reduction row would carry tens of megabytes, and the verifier would refuse it anyway.
 */
const MAX_CERTIFICATE_TABLE_ROWS = 2 ** 24;

export default shardTask(nodeEliminationTask, ({ input }, ctx): NodeEliminationResult => {
  const source = compileDefinition(readRuleText(input.ruleText));
  const p = input.params;
  const eligible = new Set(eligibleNodes(source));
  const reduced =
    p.mode === "percolate"
      ? (() => {
          const held = Object.fromEntries(p.hold.map((h) => [h.node, h.value] as const));
          const r = percolateConstants(source, held);
          return {
            network: r.network,
            eliminated: r.eliminated,
            preserves: r.preserves,
            fixed: Object.entries(r.fixed).map(([node, value]) => ({ node, value })),
            notEliminated: [] as NodeEliminationResult["notEliminated"],
            certificate: () => percolationCertificate(source, r.network, held, r.fixed),
          };
        })()
      : (() => {
          const r = eliminateNodes(source, p.mode === "nodes" ? p.nodes : "all-eligible", {
            onProgress: ctx.onProgress,
            shouldStop: ctx.shouldStop,
          });
          const limit = new Map(r.skipped.map((s) => [s.node, s.regulators] as const));
          const removed = new Set(r.eliminated);
          const notEliminated = r.network.names.flatMap((node) => {
            if (removed.has(node)) return [];
            if (!eligible.has(node)) return [{ node, reason: "regulates itself" }];
            const size = limit.get(node);
            if (size !== undefined)
              return [{ node, reason: `eliminating it would give a node ${size} regulators (at most 20)` }];
            // Eligible at the start, but the substitutions made it read its own value.
            if (p.mode === "all-eligible") return [{ node, reason: "regulates itself after the other eliminations" }];
            return [{ node, reason: "not chosen" }];
          });
          return {
            network: r.network,
            eliminated: r.eliminated,
            preserves: r.preserves,
            fixed: [],
            notEliminated,
            certificate: () => eliminationCertificate(source, r.network, r.eliminated),
          };
        })();
  const empty = reduced.network.names.length === 0;
  const tableRows = reduced.network.tables.reduce((sum, t) => sum + t.length, 0);
  const certificateNote = empty
    ? "Every node was removed, so there is no reduced model to save."
    : reduced.eliminated.length === 0
      ? "No node was removed, so the reduced model is the model itself."
      : source.names.length > MAX_CERTIFICATE_NODES
        ? `Certificates hold networks of at most ${MAX_CERTIFICATE_NODES} nodes; this model has ${source.names.length}.`
        : tableRows > MAX_CERTIFICATE_TABLE_ROWS
          ? `The reduced model's truth tables hold ${tableRows} rows; a certificate holds at most ${MAX_CERTIFICATE_TABLE_ROWS}, so it cannot be saved as a reduction.`
          : null;
  return {
    mode: p.mode,
    nodesBefore: source.names.length,
    nodesAfter: reduced.network.names.length,
    eliminated: reduced.eliminated,
    kept: [...reduced.network.names],
    notEliminated: p.mode === "percolate" ? [] : reduced.notEliminated,
    fixed: reduced.fixed,
    held: p.mode === "percolate" ? p.hold : [],
    ruleText: empty ? "" : printRuleText(networkToDefinition(reduced.network)),
    preserves: reduced.preserves,
    certificate: certificateNote === null ? reduced.certificate() : null,
    certificateNote,
  };
});

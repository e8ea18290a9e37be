// F's wiring with each node coloured by the target node its block encodes (context nodes grey, dark for 1, light
// for 0), and G's wiring beside it in the same colours, so a reader can match blocks to target nodes at a glance.
import { useMemo } from "react";
import { networkFromCertificate } from "@shared/engine/certificates";
import { interactionGraph } from "@shared/engine/structure";
import type { Certificate } from "@shared/schemas/reductions";
import { NetworkGraph, type GraphEdge, type GraphNode } from "@/components/graph/network-graph";
import { BLOCK_COLOURS, sourceNodeRoles } from "../lib/certificate-view";

const SIGN_COLOUR = { positive: "#16a34a", negative: "#dc2626", dual: "#9333ea", "non-essential": "#cbd5e1" } as const;

function edgesOf(net: ReturnType<typeof networkFromCertificate>): GraphEdge[] {
  return interactionGraph(net)
    .edges.filter((e) => e.sign !== "non-essential")
    .map((e) => ({ source: net.names[e.source]!, target: net.names[e.target]!, color: SIGN_COLOUR[e.sign] }));
}

export function ReductionDiagrams({ certificate }: { certificate: Certificate }) {
  const { sourceNodes, sourceEdges, targetNodes, targetEdges } = useMemo(() => {
    const source = networkFromCertificate(certificate.source);
    const target = networkFromCertificate(certificate.target);
    const roles = sourceNodeRoles(certificate);
    const sourceNodes: GraphNode[] = source.names.map((name) => {
      const role = roles.get(name)!;
      const suffix =
        role.contextValue !== null ? ` = ${role.contextValue}` : role.targetName ? ` → ${role.targetName}` : "";
      return { id: name, label: name + suffix, color: role.colour };
    });
    const targetNodes: GraphNode[] = target.names.map((name, j) => ({
      id: name,
      label: name,
      color: BLOCK_COLOURS[j % BLOCK_COLOURS.length]!,
      size: 12,
    }));
    return { sourceNodes, sourceEdges: edgesOf(source), targetNodes, targetEdges: edgesOf(target) };
  }, [certificate]);

  return (
    <div className="grid gap-4 lg:grid-cols-2">
      <figure>
        <figcaption className="mb-1 text-sm font-medium text-slate-700">
          Source F ({sourceNodes.length} nodes): colour = block, grey = context
        </figcaption>
        <NetworkGraph nodes={sourceNodes} edges={sourceEdges} testId="source-diagram" />
      </figure>
      <figure>
        <figcaption className="mb-1 text-sm font-medium text-slate-700">
          Target G ({targetNodes.length} nodes)
        </figcaption>
        <NetworkGraph nodes={targetNodes} edges={targetEdges} testId="target-diagram" />
      </figure>
    </div>
  );
}

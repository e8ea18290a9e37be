// The interaction graph as a scene: one node per model node, one edge per regulation (self-regulation included),
// coloured and headed by sign, laid out once with ForceAtlas2 from a deterministic circle so the picture is stable.
// Opposite regulations between two nodes bend apart; self-loops point into the emptiest side of their node.
import type { StructureResult } from "@shared/schemas/models";
import { forceLayout } from "@/components/graph/force-layout";
import { placeSelfLoops, separateParallelEdges, type GraphScene, type SceneEdge } from "@/components/graph/graph-scene";
import { NODE_COLOUR } from "@/components/graph/palette";
import { describeRegulation, signStyle } from "@/components/graph/sign-style";

export function wiringScene(structure: StructureResult): GraphScene {
  const sized = structure.nodes.map((node) => ({ id: node.name, size: 8 + Math.min(6, node.outDegree) }));
  const position = forceLayout(sized, structure.edges);
  const nodes = sized.map(({ id, size }) => ({ id, label: id, ...position.get(id)!, size, color: NODE_COLOUR }));
  const edges: SceneEdge[] = structure.edges.map((e) => ({
    id: `${e.source}->${e.target}`,
    source: e.source,
    target: e.target,
    color: signStyle[e.sign].color,
    head: signStyle[e.sign].head,
    size: 2.5,
    curvature: 0,
    description: describeRegulation(e.source, e.target, e.sign),
  }));
  return placeSelfLoops({ nodes, edges: separateParallelEdges(edges) });
}

// A certificate's network as a scene for the reduction page: its wiring (regulations that matter, self-regulation
// included) laid out by ForceAtlas2, each node styled by the caller (block colours, context values).
import type { BooleanNetwork } from "@shared/engine/network";
import { interactionGraph } from "@shared/engine/structure";
import { forceLayout } from "@/components/graph/force-layout";
import { placeSelfLoops, separateParallelEdges, type GraphScene, type SceneEdge } from "@/components/graph/graph-scene";
import { describeRegulation, signStyle } from "@/components/graph/sign-style";

export interface NodeStyle {
  label: string;
  color: string;
  size: number;
}

export function networkScene(net: BooleanNetwork, styleOf: (name: string, index: number) => NodeStyle): GraphScene {
  const wiring = interactionGraph(net).edges.filter((e) => e.sign !== "non-essential");
  const styled = net.names.map((name, i) => ({ id: name, ...styleOf(name, i) }));
  const links = wiring.map((e) => ({ source: net.names[e.source]!, target: net.names[e.target]! }));
  const position = forceLayout(styled, links);
  const edges: SceneEdge[] = wiring.map((e) => {
    const source = net.names[e.source]!;
    const target = net.names[e.target]!;
    return {
      id: `${source}->${target}`,
      source,
      target,
      color: signStyle[e.sign].color,
      head: signStyle[e.sign].head,
      size: 2,
      curvature: 0,
      description: describeRegulation(source, target, e.sign),
    };
  });
  return placeSelfLoops({
    nodes: styled.map((n) => ({ ...n, ...position.get(n.id)! })),
    edges: separateParallelEdges(edges),
  });
}

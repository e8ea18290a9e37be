// F's wiring with each node coloured by what it carries of G (the target node its block encodes, or the observable
// that reads it; context nodes grey, dark for 1, light for 0), and G's wiring beside it in the same colours with
// its rules as text, so a reader can match blocks to target nodes at a glance.
import { useMemo, useState } from "react";
import { networkFromCertificate } from "@shared/engine/certificates";
import type { Certificate } from "@shared/schemas/reductions";
import { ExportButtons } from "@/components/graph/export-buttons";
import { GraphEdgeList } from "@/components/graph/graph-edge-list";
import { GraphNodeList } from "@/components/graph/graph-node-list";
import type { GraphScene } from "@/components/graph/graph-scene";
import { drawScene } from "@/components/graph/scene-drawing";
import { SceneSigma } from "@/components/graph/scene-sigma";
import { drawingToSvg } from "@/components/graph/scene-svg";
import { BLOCK_COLOURS, observableInWords, sourceNodeRoles, targetRuleText } from "../lib/certificate-view";
import { networkScene } from "../lib/reduction-scene";
import { plural } from "@/lib/plural";

function sourceCaption(certificate: Certificate, nodeCount: number): string {
  switch (certificate.notion) {
    case "block-emulation":
      return `Source F (${plural(nodeCount, "node")}): colour = the target node its block encodes; grey = context, light for 0 and dark for 1`;
    case "coarse-graining":
      return `Source F (${plural(nodeCount, "node")}): colour = the observable that reads the node; grey = read by no observable`;
    case "dynamical-embedding":
      return `Source F (${plural(nodeCount, "node")}): G's states are mapped to whole states of F (see the state map below), so no node stands for one node of G`;
    case "node-elimination":
      return `Source F (${plural(nodeCount, "node")}): the eliminated nodes are grey, their functions substituted into the nodes they regulate`;
    case "constant-percolation":
      return `Source F (${plural(nodeCount, "node")}): fixed nodes grey, light for 0 and dark for 1`;
  }
}

function targetCaption(certificate: Certificate, nodeCount: number): string {
  switch (certificate.notion) {
    case "block-emulation":
      return `Target G (${plural(nodeCount, "node")}), one colour per node as its block in F`;
    case "coarse-graining":
      return `Target G (${plural(nodeCount, "node")}): the observables of F, one step of G for ${certificate.time} of F`;
    case "dynamical-embedding":
    case "node-elimination":
    case "constant-percolation":
      return `Target G (${plural(nodeCount, "node")})`;
  }
}

function Diagram({
  scene,
  testId,
  fileName,
  title,
}: {
  scene: GraphScene;
  testId: string;
  fileName: string;
  title: string;
}) {
  const [focus, setFocus] = useState<string | null>(null);
  return (
    <div className="space-y-2">
      <SceneSigma
        scene={scene}
        height={340}
        focus={focus}
        onHoverNode={setFocus}
        testId={testId}
        description={`${title}: ${scene.nodes.length} nodes and ${scene.edges.length} regulations; listed as text below.`}
      />
      <div className="flex flex-wrap items-start justify-between gap-2">
        <GraphNodeList
          nodes={scene.nodes.map((n) => ({ id: n.id, label: n.label }))}
          label={`Nodes of ${title}`}
          hint="Tab to a node to see its regulations in the picture."
          onFocusNode={setFocus}
          onActivate={(id) => setFocus(id)}
          testId={`${testId}-nodes`}
        />
        <ExportButtons
          svg={() => drawingToSvg(drawScene(scene), title)}
          fileName={fileName}
          testIdPrefix={`${testId}-download`}
        />
      </div>
      <GraphEdgeList edges={scene.edges} testId={`${testId}-edges`} />
    </div>
  );
}

export function ReductionDiagrams({ certificate }: { certificate: Certificate }) {
  const { sourceScene, targetScene, ruleText } = useMemo(() => {
    const source = networkFromCertificate(certificate.source);
    const target = networkFromCertificate(certificate.target);
    const roles = sourceNodeRoles(certificate);
    const sourceScene = networkScene(source, (name) => {
      const role = roles.get(name)!;
      const suffix =
        role.contextValue !== null ? ` = ${role.contextValue}` : role.targetName ? ` → ${role.targetName}` : "";
      return { label: name + suffix, color: role.colour, size: 9 };
    });
    const targetScene = networkScene(target, (name, j) => ({
      label: name,
      color: BLOCK_COLOURS[j % BLOCK_COLOURS.length]!,
      size: 11,
    }));
    return { sourceScene, targetScene, ruleText: targetRuleText(certificate) };
  }, [certificate]);

  return (
    <div className="grid min-w-0 gap-6 lg:grid-cols-2">
      <figure className="min-w-0 space-y-1">
        <figcaption className="text-sm font-medium text-slate-700" data-testid="source-caption">
          {sourceCaption(certificate, sourceScene.nodes.length)}
        </figcaption>
        <Diagram scene={sourceScene} testId="source-diagram" fileName="source-F" title="Source F" />
        {certificate.notion === "coarse-graining" && (
          <ul className="list-disc space-y-0.5 pl-5 text-sm text-slate-700" data-testid="observables-in-words">
            {certificate.witness.observables.map((o) => (
              <li key={o.target}>{observableInWords(o)}</li>
            ))}
          </ul>
        )}
      </figure>
      <figure className="min-w-0 space-y-1">
        <figcaption className="text-sm font-medium text-slate-700" data-testid="target-caption">
          {targetCaption(certificate, targetScene.nodes.length)}
        </figcaption>
        <div className="grid gap-3 sm:grid-cols-[minmax(0,1fr)_auto]">
          <Diagram scene={targetScene} testId="target-diagram" fileName="target-G" title="Target G" />
          <div className="min-w-0 sm:max-w-64">
            <p className="text-xs font-medium uppercase text-slate-500">G's rules</p>
            <pre
              className="mt-1 overflow-x-auto rounded-md border border-slate-200 bg-slate-50 p-2 text-xs text-slate-800"
              data-testid="target-rules"
            >
              {ruleText}
            </pre>
          </div>
        </div>
      </figure>
    </div>
  );
}

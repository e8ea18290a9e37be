// A scene drawn with sigma (WebGL) through @react-sigma/core. Edges are quadratic curves from @sigma/edge-curve (a
// pair of opposite edges bends apart; a repression ends in a flat, wide head); self-loops, which sigma cannot
// draw, are painted on a canvas layer between the edges and the nodes with the same shapes the SVG export uses.
// Every node keeps its label, placed on the side that stays inside the drawing area.
import "@react-sigma/core/lib/style.css";
import { SigmaContainer, useLoadGraph, useRegisterEvents, useSetSettings, useSigma } from "@react-sigma/core";
import { createDrawCurvedEdgeLabel, createEdgeCurveProgram } from "@sigma/edge-curve";
import Graph from "graphology";
import { createEdgeArrowProgram } from "sigma/rendering";
import { useEffect, useMemo, useRef } from "react";
import type { Settings } from "sigma/settings";
import { headPolygon, selfLoop } from "./edge-geometry";
import { isSelfLoop, type EdgeHead, type GraphScene } from "./graph-scene";
import { LABEL_FONT_SIZE, placeLabel } from "./label-placement";
import { BACKGROUND_COLOUR, FOCUS_COLOUR, GRAPH_FONT, MUTED_COLOUR, TEXT_COLOUR } from "./palette";

interface NodeAttrs {
  x: number;
  y: number;
  size: number;
  label: string;
  color: string;
  forceLabel: boolean;
}
/** Sigma program per edge: straight or curved (the curve program draws nothing at curvature 0), arrow or bar. */
type EdgeType = EdgeHead | `curved-${EdgeHead}`;
interface EdgeAttrs {
  size: number;
  color: string;
  type: EdgeType;
  curvature: number;
  label?: string;
}

/** Sigma's graph: y flipped (sigma's y grows upward), self-loops left to the overlay. */
export function sigmaGraph(scene: GraphScene): Graph<NodeAttrs, EdgeAttrs> {
  const graph = new Graph<NodeAttrs, EdgeAttrs>({ type: "directed", multi: true, allowSelfLoops: false });
  for (const n of scene.nodes)
    graph.addNode(n.id, { x: n.x, y: -n.y, size: n.size, label: n.label, color: n.color, forceLabel: true });
  for (const e of scene.edges) {
    if (isSelfLoop(e) || !graph.hasNode(e.source) || !graph.hasNode(e.target)) continue;
    graph.addDirectedEdgeWithKey(e.id, e.source, e.target, {
      size: e.size,
      color: e.color,
      type: e.curvature === 0 ? e.head : `curved-${e.head}`,
      curvature: e.curvature,
      label: e.label,
    });
  }
  return graph;
}

// Heads a little larger than sigma's defaults, so arrow and bar are told apart at a glance.
const ARROW_HEAD = { lengthToThicknessRatio: 4, widenessToThicknessRatio: 3.2 };
const BAR_HEAD = { lengthToThicknessRatio: 1.6, widenessToThicknessRatio: 8 };

type LabelData = { x: number; y: number; size: number; label: string | null; color: string };

/** Counts what the last frame drew, for the page (and its tests) to read off the container. */
interface FrameCounts {
  labels: number;
  loops: number;
}

function labelDrawer(counts: FrameCounts, below: boolean) {
  return (context: CanvasRenderingContext2D, data: LabelData) => {
    if (!data.label) return;
    const width = context.canvas.width / (context.getTransform().a || 1);
    context.font = `600 ${LABEL_FONT_SIZE}px ${GRAPH_FONT}`;
    context.textBaseline = "middle";
    context.lineWidth = 3;
    context.strokeStyle = BACKGROUND_COLOUR;
    context.fillStyle = TEXT_COLOUR;
    const textWidth = context.measureText(data.label).width;
    let x: number;
    let y = data.y;
    if (below) {
      context.textAlign = "center";
      x = Math.min(width - textWidth / 2 - 2, Math.max(textWidth / 2 + 2, data.x));
      y = data.y + data.size + LABEL_FONT_SIZE * 0.8;
    } else {
      const placed = placeLabel(data.x, data.size, textWidth, 2, width - 2);
      context.textAlign = placed.anchor === "start" ? "left" : "right";
      x = placed.x;
    }
    context.strokeText(data.label, x, y);
    context.fillText(data.label, x, y);
    counts.labels++;
  };
}

/** Hovered or focused node: a ring in the focus colour, then its label on a white plate. */
function hoverDrawer(counts: FrameCounts, below: boolean) {
  const drawLabel = labelDrawer(counts, below);
  return (context: CanvasRenderingContext2D, data: LabelData) => {
    context.beginPath();
    context.arc(data.x, data.y, data.size + 4, 0, 2 * Math.PI);
    context.lineWidth = 3;
    context.strokeStyle = FOCUS_COLOUR;
    context.stroke();
    if (!data.label) return;
    const before = counts.labels;
    drawLabel(context, data);
    counts.labels = before; // a hover redraws a label already counted
  };
}

interface Behaviour {
  scene: GraphScene;
  focus: string | null;
  emphasis: string | null;
  colourOf?: (id: string, colour: string) => string;
  showEdgeLabels: boolean;
  counts: FrameCounts;
  container: React.RefObject<HTMLDivElement | null>;
  onHoverNode?: (id: string | null) => void;
  onClickNode?: (id: string) => void;
}

function GraphLoader({ scene }: { scene: GraphScene }) {
  const loadGraph = useLoadGraph<NodeAttrs, EdgeAttrs>();
  const graph = useMemo(() => sigmaGraph(scene), [scene]);
  useEffect(() => loadGraph(graph), [loadGraph, graph]);
  return null;
}

function Behaviours({
  scene,
  focus,
  emphasis,
  colourOf,
  showEdgeLabels,
  counts,
  container,
  onHoverNode,
  onClickNode,
}: Behaviour) {
  const sigma = useSigma<NodeAttrs, EdgeAttrs>();
  const registerEvents = useRegisterEvents<NodeAttrs, EdgeAttrs>();
  const setSettings = useSetSettings<NodeAttrs, EdgeAttrs>();
  const loops = useMemo(() => scene.edges.filter(isSelfLoop), [scene]);
  // The loop layer draws on sigma's render events, outside React: it reads the latest focus and loops from a ref
  // that this effect keeps current (it runs before the settings effect below, whose change triggers the redraw).
  const state = useRef({ focus, loops });
  useEffect(() => {
    state.current = { focus, loops };
  }, [focus, loops]);

  useEffect(() => {
    registerEvents({
      enterNode: (e) => onHoverNode?.(e.node),
      leaveNode: () => onHoverNode?.(null),
      clickNode: (e) => onClickNode?.(e.node),
    });
  }, [registerEvents, onHoverNode, onClickNode]);

  useEffect(() => {
    const graph = sigma.getGraph();
    const near = new Set<string>();
    if (focus && graph.hasNode(focus)) {
      near.add(focus);
      graph.forEachNeighbor(focus, (n) => near.add(n));
    }
    setSettings({
      nodeReducer: (node, data) => {
        const colour = colourOf ? colourOf(node, data.color) : data.color;
        if (node === focus || node === emphasis) return { ...data, color: colour, highlighted: true, zIndex: 2 };
        if (focus && !near.has(node)) return { ...data, color: MUTED_COLOUR, zIndex: 0 };
        return { ...data, color: colour, zIndex: near.has(node) ? 1 : 0 };
      },
      edgeReducer: (edge, data) => {
        if (!focus) return showEdgeLabels ? data : { ...data, label: undefined };
        const [s, t] = graph.extremities(edge);
        return s === focus || t === focus ? { ...data, size: data.size + 1.5, zIndex: 1 } : { ...data, hidden: true };
      },
    });
  }, [sigma, setSettings, focus, emphasis, colourOf, showEdgeLabels]);

  // Self-loops on their own canvas layer, redrawn after every frame sigma draws.
  useEffect(() => {
    const layer = "selfLoops";
    const canvas = sigma.createCanvas(layer, { afterLayer: "edges" });
    const ctx = canvas.getContext("2d")!;
    const before = () => {
      counts.labels = 0;
      counts.loops = 0;
    };
    const draw = () => {
      // sigma sizes the layers it made itself; this one follows the viewport here
      const ratio = window.devicePixelRatio || 1;
      const { width, height } = sigma.getDimensions();
      if (canvas.width !== Math.round(width * ratio) || canvas.height !== Math.round(height * ratio)) {
        canvas.width = Math.round(width * ratio);
        canvas.height = Math.round(height * ratio);
        canvas.style.width = `${width}px`;
        canvas.style.height = `${height}px`;
      }
      ctx.setTransform(ratio, 0, 0, ratio, 0, 0);
      ctx.clearRect(0, 0, canvas.width, canvas.height);
      const { focus: focused, loops: drawn } = state.current;
      for (const e of drawn) {
        if (focused && e.source !== focused) continue;
        const node = sigma.getNodeDisplayData(e.source);
        if (!node || node.hidden) continue;
        const centre = sigma.framedGraphToViewport(node);
        const radius = sigma.scaleSize(node.size);
        // the viewport's y grows downward like the scene's, so the scene's loop angle holds as it is
        const width = e.size + (focused ? 1.5 : 0);
        const shape = selfLoop(centre, radius, e.loopAngle ?? -Math.PI / 2, e.head, width);
        ctx.strokeStyle = e.color;
        ctx.fillStyle = e.color;
        ctx.lineWidth = width;
        ctx.lineCap = "round";
        ctx.stroke(new Path2D(shape.path));
        const head = headPolygon(shape.tip, shape.direction, e.head, width);
        ctx.beginPath();
        head.forEach((p, i) => (i ? ctx.lineTo(p.x, p.y) : ctx.moveTo(p.x, p.y)));
        ctx.closePath();
        ctx.fill();
        counts.loops++;
      }
      const el = container.current;
      if (el) {
        el.dataset.labelsDrawn = String(counts.labels);
        el.dataset.loopsDrawn = String(counts.loops);
      }
    };
    sigma.on("beforeRender", before);
    sigma.on("afterRender", draw);
    sigma.refresh();
    return () => {
      sigma.off("beforeRender", before);
      sigma.off("afterRender", draw);
      // Leaving the page kills sigma (and with it every layer) before this cleanup runs.
      if (sigma.getCanvases()[layer]) sigma.killLayer(layer);
    };
  }, [sigma, counts, container]);

  // Centre on an emphasised node (a search hit) once per hit; display data exist only after a render with it.
  useEffect(() => {
    if (!emphasis) return;
    const centre = () => {
      const pos = sigma.getNodeDisplayData(emphasis);
      if (pos) sigma.getCamera().animate({ x: pos.x, y: pos.y, ratio: 0.8 }, { duration: 250 });
    };
    sigma.once("afterRender", centre);
    sigma.scheduleRefresh();
    return () => {
      sigma.off("afterRender", centre);
      sigma.getCamera().setState({ x: 0.5, y: 0.5, ratio: 1 });
    };
  }, [sigma, emphasis]);

  // A new focus or a new set of loops must reach the overlay even when sigma has nothing else to redraw.
  useEffect(() => {
    sigma.scheduleRefresh();
  }, [sigma, focus, loops]);
  return null;
}

export interface SceneSigmaProps {
  scene: GraphScene;
  /** CSS height of the drawing area. */
  height: number;
  /** The node whose neighbourhood is shown (hover, keyboard focus or selection); others are muted. */
  focus?: string | null;
  /** A node marked and centred without muting the others (a search hit). */
  emphasis?: string | null;
  colourOf?: (id: string, colour: string) => string;
  /** Edge labels when nothing is focused; with a focus the focused edges always show theirs. */
  showEdgeLabels?: boolean;
  labelsBelow?: boolean;
  onHoverNode?: (id: string | null) => void;
  onClickNode?: (id: string) => void;
  testId?: string;
  /** The text alternative read out for the picture. */
  description: string;
}

export function SceneSigma({
  scene,
  height,
  focus = null,
  emphasis = null,
  colourOf,
  showEdgeLabels = true,
  labelsBelow = false,
  onHoverNode,
  onClickNode,
  testId,
  description,
}: SceneSigmaProps) {
  const container = useRef<HTMLDivElement>(null);
  const counts = useMemo<FrameCounts>(() => ({ labels: 0, loops: 0 }), []);
  const settings = useMemo(
    (): Partial<Settings<NodeAttrs, EdgeAttrs>> => ({
      // A container can be 0 px wide for a frame while the page lays out; sigma then waits for the resize.
      allowInvalidContainer: true,
      defaultEdgeType: "arrow",
      edgeProgramClasses: {
        arrow: createEdgeArrowProgram<NodeAttrs, EdgeAttrs>(ARROW_HEAD),
        "curved-arrow": createEdgeCurveProgram<NodeAttrs, EdgeAttrs>({
          arrowHead: { extremity: "target", ...ARROW_HEAD },
        }),
        // A short, very wide head reads as the flat bar of a repression.
        bar: createEdgeArrowProgram<NodeAttrs, EdgeAttrs>(BAR_HEAD),
        "curved-bar": createEdgeCurveProgram<NodeAttrs, EdgeAttrs>({ arrowHead: { extremity: "target", ...BAR_HEAD } }),
      },
      defaultDrawEdgeLabel: createDrawCurvedEdgeLabel<NodeAttrs, EdgeAttrs>({
        curvatureAttribute: "curvature",
        defaultCurvature: 0,
        arrowHead: null,
        keepLabelUpright: true,
      }),
      defaultDrawNodeLabel: labelDrawer(counts, labelsBelow),
      defaultDrawNodeHover: hoverDrawer(counts, labelsBelow),
      renderEdgeLabels: true,
      edgeLabelFont: GRAPH_FONT,
      edgeLabelSize: 11,
      edgeLabelWeight: "600",
      edgeLabelColor: { attribute: "color" },
      labelFont: GRAPH_FONT,
      labelSize: LABEL_FONT_SIZE,
      labelWeight: "600",
      labelRenderedSizeThreshold: 0,
      zIndex: true,
      stagePadding: 44,
    }),
    [counts, labelsBelow],
  );
  const loops = scene.edges.filter(isSelfLoop).length;
  return (
    <div
      ref={container}
      data-testid={testId}
      data-nodes={scene.nodes.length}
      data-edges={scene.edges.length}
      data-loops={loops}
      role="img"
      aria-label={description}
      className="relative w-full overflow-hidden rounded-lg border border-slate-200 bg-white"
      style={{ height }}
    >
      <SigmaContainer<NodeAttrs, EdgeAttrs> style={{ height: "100%", width: "100%" }} settings={settings}>
        <GraphLoader scene={scene} />
        <Behaviours
          scene={scene}
          focus={focus}
          emphasis={emphasis}
          colourOf={colourOf}
          showEdgeLabels={showEdgeLabels}
          counts={counts}
          container={container}
          onHoverNode={onHoverNode}
          onClickNode={onClickNode}
        />
      </SigmaContainer>
    </div>
  );
}

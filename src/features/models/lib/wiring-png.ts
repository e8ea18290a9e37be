// PNG of the wiring diagram as it is on screen, redrawn on a 2D canvas from sigma's viewport coordinates (the WebGL
// buffers are not kept after drawing, so reading them back would give an empty picture).
import type Sigma from "sigma";
import { signStyle, type WiringEdgeAttrs, type WiringNodeAttrs } from "./wiring-graph";

export function drawWiringPng(sigma: Sigma<WiringNodeAttrs, WiringEdgeAttrs>, state: string | null): string {
  const graph = sigma.getGraph();
  const { width, height } = sigma.getDimensions();
  const scale = 2;
  const canvas = document.createElement("canvas");
  canvas.width = width * scale;
  canvas.height = height * scale;
  const ctx = canvas.getContext("2d")!;
  ctx.scale(scale, scale);
  ctx.fillStyle = "#ffffff";
  ctx.fillRect(0, 0, width, height);
  const order = graph.nodes();
  const pos = new Map<string, { x: number; y: number; r: number }>();
  graph.forEachNode((node, a) => {
    const d = sigma.getNodeDisplayData(node);
    if (!d) return;
    const p = sigma.framedGraphToViewport(d);
    pos.set(node, { x: p.x, y: p.y, r: sigma.scaleSize(d.size) });
    void a;
  });
  graph.forEachEdge((_e, attrs, source, target) => {
    const s = pos.get(source);
    const t = pos.get(target);
    if (!s || !t) return;
    const dx = t.x - s.x;
    const dy = t.y - s.y;
    const len = Math.hypot(dx, dy) || 1;
    const ux = dx / len;
    const uy = dy / len;
    const ex = t.x - ux * (t.r + 2);
    const ey = t.y - uy * (t.r + 2);
    const colour = signStyle[attrs.sign].color;
    ctx.strokeStyle = colour;
    ctx.fillStyle = colour;
    ctx.lineWidth = 1.5;
    ctx.beginPath();
    ctx.moveTo(s.x, s.y);
    ctx.lineTo(ex, ey);
    ctx.stroke();
    if (attrs.sign === "negative") {
      ctx.lineWidth = 3;
      ctx.beginPath();
      ctx.moveTo(ex - uy * 6, ey + ux * 6);
      ctx.lineTo(ex + uy * 6, ey - ux * 6);
      ctx.stroke();
    } else {
      ctx.beginPath();
      ctx.moveTo(ex, ey);
      ctx.lineTo(ex - ux * 9 - uy * 4.5, ey - uy * 9 + ux * 4.5);
      ctx.lineTo(ex - ux * 9 + uy * 4.5, ey - uy * 9 - ux * 4.5);
      ctx.closePath();
      ctx.fill();
    }
  });
  ctx.font = '600 12px "Inter Variable", sans-serif';
  ctx.textBaseline = "middle";
  graph.forEachNode((node, a) => {
    const p = pos.get(node);
    if (!p) return;
    ctx.fillStyle = state ? (state[order.indexOf(node)] === "1" ? "#0d9488" : "#cbd5e1") : a.color;
    ctx.beginPath();
    ctx.arc(p.x, p.y, p.r, 0, 2 * Math.PI);
    ctx.fill();
    ctx.fillStyle = "#0f172a";
    ctx.fillText(a.label, p.x + p.r + 3, p.y);
  });
  return canvas.toDataURL("image/png");
}

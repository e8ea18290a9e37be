// A drawing written out as a standalone SVG document: the SVG export, and the source of the PNG export.
import { BACKGROUND_COLOUR, GRAPH_FONT, TEXT_COLOUR } from "./palette";
import { polygonPoints } from "./edge-geometry";
import type { Drawing } from "./scene-drawing";

const escapeXml = (text: string) =>
  text.replace(/[<>&"']/g, (c) => ({ "<": "&lt;", ">": "&gt;", "&": "&amp;", '"': "&quot;", "'": "&apos;" })[c]!);
const n = (v: number) => (Math.round(v * 100) / 100).toString();

export function drawingToSvg(drawing: Drawing, title: string): string {
  const { box, fontSize } = drawing;
  const lines: string[] = [];
  lines.push(
    `<svg xmlns="http://www.w3.org/2000/svg" viewBox="${n(box.x)} ${n(box.y)} ${n(box.width)} ${n(box.height)}" width="${Math.ceil(box.width)}" height="${Math.ceil(box.height)}" role="img" aria-labelledby="title desc">`,
    `<title id="title">${escapeXml(title)}</title>`,
    `<desc id="desc">${escapeXml(drawing.edges.map((e) => e.description).join("; "))}</desc>`,
    `<rect x="${n(box.x)}" y="${n(box.y)}" width="${n(box.width)}" height="${n(box.height)}" fill="${BACKGROUND_COLOUR}"/>`,
    `<g fill="none" stroke-linecap="round">`,
  );
  for (const e of drawing.edges) {
    lines.push(
      `<path d="${e.path}" stroke="${e.color}" stroke-width="${n(e.width)}" data-source="${escapeXml(e.source)}" data-target="${escapeXml(e.target)}"><title>${escapeXml(e.description)}</title></path>`,
    );
  }
  lines.push(`</g>`, `<g stroke="none">`);
  for (const e of drawing.edges) lines.push(`<polygon points="${polygonPoints(e.headPoints)}" fill="${e.color}"/>`);
  lines.push(`</g>`);
  lines.push(
    `<g font-family='${GRAPH_FONT}' font-size="${fontSize - 2}" text-anchor="middle" dominant-baseline="middle" paint-order="stroke" stroke="${BACKGROUND_COLOUR}" stroke-width="3">`,
  );
  for (const e of drawing.edges) {
    if (e.label)
      lines.push(`<text x="${n(e.label.x)}" y="${n(e.label.y)}" fill="${e.color}">${escapeXml(e.label.text)}</text>`);
  }
  lines.push(`</g>`, `<g>`);
  for (const node of drawing.nodes) {
    lines.push(
      `<circle cx="${n(node.cx)}" cy="${n(node.cy)}" r="${n(node.r)}" fill="${node.color}" data-id="${escapeXml(node.id)}"/>`,
    );
  }
  lines.push(
    `</g>`,
    `<g font-family='${GRAPH_FONT}' font-size="${fontSize}" font-weight="600" fill="${TEXT_COLOUR}" dominant-baseline="middle" paint-order="stroke" stroke="${BACKGROUND_COLOUR}" stroke-width="3">`,
  );
  for (const node of drawing.nodes) {
    lines.push(
      `<text x="${n(node.labelX)}" y="${n(node.labelY)}" text-anchor="${node.anchor}">${escapeXml(node.label)}</text>`,
    );
  }
  lines.push(`</g>`, `</svg>`);
  return lines.join("\n");
}

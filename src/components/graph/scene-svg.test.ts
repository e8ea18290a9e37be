import fc from "fast-check";
import { XMLParser, XMLValidator } from "fast-xml-parser";
import { describe, expect, it } from "vitest";
import { placeSelfLoops, separateParallelEdges, type GraphScene, type SceneEdge } from "./graph-scene";
import { estimateTextWidth } from "./label-placement";
import { SIGN_COLOURS } from "./palette";
import { drawScene } from "./scene-drawing";
import { drawingToSvg } from "./scene-svg";

const sceneArb: fc.Arbitrary<GraphScene> = fc
  .uniqueArray(fc.stringMatching(/^[A-Za-z][A-Za-z0-9_]{0,14}$/), { minLength: 1, maxLength: 8 })
  .chain((ids) =>
    fc
      .record({
        positions: fc.array(
          fc.tuple(fc.double({ min: -50, max: 50, noNaN: true }), fc.double({ min: -50, max: 50, noNaN: true })),
          {
            minLength: ids.length,
            maxLength: ids.length,
          },
        ),
        edges: fc.array(
          fc.tuple(
            fc.constantFrom(...ids),
            fc.constantFrom(...ids),
            fc.constantFrom("positive", "negative") as fc.Arbitrary<"positive" | "negative">,
          ),
          { maxLength: 12 },
        ),
      })
      .map(({ positions, edges }) => {
        const unique = [...new Map(edges.map((e) => [`${e[0]}>${e[1]}`, e] as const)).values()];
        const sceneEdges: SceneEdge[] = unique.map(([s, t, sign]) => ({
          id: `${s}->${t}`,
          source: s,
          target: t,
          color: SIGN_COLOURS[sign],
          head: sign === "negative" ? "bar" : "arrow",
          size: 2,
          curvature: 0,
          description: `${s} ${sign === "negative" ? "represses" : "activates"} ${t}`,
        }));
        return placeSelfLoops({
          nodes: ids.map((id, i) => ({
            id,
            label: id,
            x: positions[i]![0],
            y: positions[i]![1],
            size: 8,
            color: "#334155",
          })),
          edges: separateParallelEdges(sceneEdges),
        });
      }),
  );

const parser = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: "" });
const asArray = <T>(v: T | T[] | undefined): T[] => (v === undefined ? [] : Array.isArray(v) ? v : [v]);

describe("drawingToSvg", () => {
  it("drawingToSvg writes well-formed SVG with one path per edge, self-loops included, in the screen's colours", () => {
    fc.assert(
      fc.property(sceneArb, (scene) => {
        const svg = drawingToSvg(drawScene(scene), "test");
        expect(XMLValidator.validate(svg)).toBe(true);
        const doc = parser.parse(svg).svg;
        const paths = asArray(doc.g[0].path) as {
          d: string;
          stroke: string;
          "data-source": string;
          "data-target": string;
        }[];
        expect(paths.map((p) => `${p["data-source"]}->${p["data-target"]}`)).toEqual(scene.edges.map((e) => e.id));
        expect(paths.map((p) => p.stroke)).toEqual(scene.edges.map((e) => e.color));
        expect(asArray(doc.g[1].polygon)).toHaveLength(scene.edges.length);
      }),
      { seed: 42, numRuns: 150 },
    );
  });

  it("drawScene's box holds every node label, so none is cut off at the edge of the picture", () => {
    fc.assert(
      fc.property(sceneArb, (scene) => {
        const drawing = drawScene(scene);
        const { box } = drawing;
        for (const n of drawing.nodes) {
          const w = estimateTextWidth(n.label);
          const from = n.anchor === "start" ? n.labelX : n.labelX - w;
          expect(from).toBeGreaterThanOrEqual(box.x);
          expect(from + w).toBeLessThanOrEqual(box.x + box.width);
          expect(n.cy - n.r).toBeGreaterThanOrEqual(box.y);
        }
      }),
      { seed: 5, numRuns: 150 },
    );
  });

  it("drawingToSvg escapes names and draws two opposite edges along different curves", () => {
    const scene = separateParallelEdges([
      {
        id: "a",
        source: "A&B",
        target: "C",
        color: "#000",
        head: "arrow" as const,
        size: 2,
        curvature: 0,
        description: "A&B activates C",
      },
      {
        id: "b",
        source: "C",
        target: "A&B",
        color: "#000",
        head: "arrow" as const,
        size: 2,
        curvature: 0,
        description: "C activates A&B",
      },
    ]);
    const svg = drawingToSvg(
      drawScene({
        nodes: [
          { id: "A&B", label: "A&B <1>", x: 0, y: 0, size: 8, color: "#000" },
          { id: "C", label: "C", x: 10, y: 0, size: 8, color: "#000" },
        ],
        edges: scene,
      }),
      "a < b",
    );
    expect(XMLValidator.validate(svg)).toBe(true);
    expect(svg).toContain("A&amp;B &lt;1&gt;");
    const paths = asArray(parser.parse(svg).svg.g[0].path) as { d: string }[];
    expect(paths).toHaveLength(2);
    expect(paths[0]!.d).toContain("Q");
    // the control points (the numbers after Q) lie on opposite sides of the line y = 0
    const controlY = (d: string) => Number(d.split("Q")[1]!.split(" ")[1]);
    expect(Math.sign(controlY(paths[0]!.d))).toBe(-Math.sign(controlY(paths[1]!.d)));
  });
});

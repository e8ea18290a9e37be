// A drawing shown on the page as inline SVG, for layered graphs whose routed arrows sigma cannot draw. It is the same
// drawing the SVG export writes. Each node is a link: Tab reaches it, Enter follows it, focus draws a ring.
import { useState } from "react";
import { polygonPoints } from "./edge-geometry";
import { BACKGROUND_COLOUR, FOCUS_COLOUR, GRAPH_FONT, TEXT_COLOUR } from "./palette";
import type { Drawing } from "./scene-drawing";

export interface SceneSvgViewProps {
  drawing: Drawing;
  /** A short summary read out for the picture; the edges are listed beside it as text. */
  description: string;
  hrefOf(id: string): string;
  onActivate(id: string): void;
  testId?: string;
}

export function SceneSvgView({ drawing, description, hrefOf, onActivate, testId }: SceneSvgViewProps) {
  const [focused, setFocused] = useState<string | null>(null);
  const { box, fontSize } = drawing;
  return (
    <svg
      data-testid={testId}
      data-nodes={drawing.nodes.length}
      data-edges={drawing.edges.length}
      viewBox={`${box.x} ${box.y} ${box.width} ${box.height}`}
      width={box.width}
      className="h-auto max-w-full"
      role="group"
      aria-label={description}
      style={{ fontFamily: GRAPH_FONT }}
    >
      <g fill="none" strokeLinecap="round" aria-hidden="true">
        {drawing.edges.map((e) => (
          <path
            key={e.id}
            d={e.path}
            stroke={e.color}
            strokeWidth={e.width}
            data-source={e.source}
            data-target={e.target}
          />
        ))}
      </g>
      <g aria-hidden="true">
        {drawing.edges.map((e) => (
          <polygon key={e.id} points={polygonPoints(e.headPoints)} fill={e.color} />
        ))}
      </g>
      <g
        aria-hidden="true"
        fontSize={fontSize - 2}
        fontWeight={600}
        textAnchor="middle"
        dominantBaseline="middle"
        paintOrder="stroke"
        stroke={BACKGROUND_COLOUR}
        strokeWidth={3}
      >
        {drawing.edges.map(
          (e) =>
            e.label && (
              <text key={e.id} x={e.label.x} y={e.label.y} fill={e.color}>
                {e.label.text}
              </text>
            ),
        )}
      </g>
      {drawing.nodes.map((n) => (
        <a
          key={n.id}
          href={hrefOf(n.id)}
          aria-label={n.label}
          data-node-id={n.id}
          onClick={(event) => {
            event.preventDefault();
            onActivate(n.id);
          }}
          onFocus={() => setFocused(n.id)}
          onBlur={() => setFocused(null)}
          onMouseEnter={() => setFocused(n.id)}
          onMouseLeave={() => setFocused(null)}
          className="cursor-pointer outline-none"
        >
          {focused === n.id && (
            <circle
              cx={n.cx}
              cy={n.cy}
              r={n.r + 4}
              fill="none"
              stroke={FOCUS_COLOUR}
              strokeWidth={3}
              data-focus-ring=""
            />
          )}
          <circle cx={n.cx} cy={n.cy} r={n.r} fill={n.color} data-id={n.id} />
          <text
            x={n.labelX}
            y={n.labelY}
            textAnchor={n.anchor}
            dominantBaseline="middle"
            fontSize={fontSize}
            fontWeight={600}
            fill={focused === n.id ? FOCUS_COLOUR : TEXT_COLOUR}
            paintOrder="stroke"
            stroke={BACKGROUND_COLOUR}
            strokeWidth={3}
            textDecoration={focused === n.id ? "underline" : undefined}
          >
            {n.label}
          </text>
        </a>
      ))}
    </svg>
  );
}

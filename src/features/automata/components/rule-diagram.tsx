// A rule's own space-time diagram from a seeded random configuration on a ring, so every visit shows the same picture.
import { useMemo } from "react";
import seedrandom from "seedrandom";
import { ecaRule, spaceTimeDiagram } from "@shared/engine/automata";
import { SpaceTimeCanvas } from "./space-time-canvas";

const WIDTH = 160;
const STEPS = 80;

export function RuleDiagram({ rule }: { rule: number }) {
  const diagram = useMemo(() => {
    const random = seedrandom(`rule-${rule}`);
    const initial = new Uint8Array(WIDTH);
    for (let i = 0; i < WIDTH; i++) initial[i] = random() < 0.5 ? 1 : 0;
    return spaceTimeDiagram(ecaRule(rule), initial, STEPS);
  }, [rule]);
  return (
    <figure className="space-y-1">
      <SpaceTimeCanvas
        cells={diagram.cells}
        width={diagram.width}
        rows={diagram.steps + 1}
        cellWidth={4}
        cellHeight={4}
        label={`Space-time diagram of rule ${rule}`}
        testId="rule-diagram"
      />
      <figcaption className="text-xs text-slate-500">
        Rule {rule} on a ring of {WIDTH} cells from a random start, {STEPS} steps; time runs down.
      </figcaption>
    </figure>
  );
}

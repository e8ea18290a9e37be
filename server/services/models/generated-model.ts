// Generator parameters to a model definition: ring automata and NK networks come back as tables and are turned
// into rules, threshold networks come back as rules. Randomness is seeded here (the engine never draws on its own).
import seedrandom from "seedrandom";
import { EngineError } from "@shared/engine/errors";
import { cellularAutomaton, nkNetwork, thresholdNetwork } from "@shared/engine/generators";
import { networkToDefinition } from "@shared/engine/rules";
import type { GeneratorParams } from "@shared/schemas/models";
import { HttpError } from "../../http/errors";
import { compileOrFail, type ReadModel } from "./model-reading";

export function generatedModel(spec: GeneratorParams): ReadModel {
  try {
    switch (spec.kind) {
      case "eca": {
        const net = cellularAutomaton({ cells: spec.cells, rule: spec.rule, radius: spec.radius });
        return { definition: networkToDefinition(net), network: net };
      }
      case "nk": {
        const net = nkNetwork({ n: spec.n, k: spec.k, p: spec.p, random: seedrandom(String(spec.seed)) });
        return { definition: networkToDefinition(net), network: net };
      }
      case "threshold":
        return compileOrFail(
          thresholdNetwork({ n: spec.n, k: spec.k, tie: spec.tie, random: seedrandom(String(spec.seed)) }),
          "The generated model",
        );
    }
  } catch (e) {
    if (e instanceof EngineError) throw new HttpError(400, "INVALID_INPUT", e.message);
    throw e;
  }
}

// A perturbation as the API takes it: node names instead of indices, answered with HTTP errors. The view itself is
// the engine's (shared/engine/perturbation); only name resolution and error mapping live here.
import { EngineError } from "@shared/engine/errors";
import type { BooleanNetwork } from "@shared/engine/network";
import { perturbNetwork } from "@shared/engine/perturbation";
import { HttpError } from "../../http/errors";

export interface NamedPerturbation {
  knockOut: readonly string[];
  overExpress: readonly string[];
  fixed: Readonly<Record<string, 0 | 1>>;
}

export function perturbedNetwork(net: BooleanNetwork, p: NamedPerturbation): BooleanNetwork {
  const index = (name: string) => {
    const i = net.names.indexOf(name);
    if (i < 0) throw new HttpError(400, "UNKNOWN_NODE", `${name} is not a node of the model`);
    return i;
  };
  const fixed = Object.entries(p.fixed).map(([name, value]) => [index(name), value] as const);
  try {
    // Fixed conditions go in as plain holds, not as the engine's fixedInputs: the API has always accepted any node
    // there, and the engine's input-only check would turn such requests into errors.
    return perturbNetwork(net, {
      knockOut: [...p.knockOut.map(index), ...fixed.filter(([, v]) => v === 0).map(([i]) => i)],
      overExpress: [...p.overExpress.map(index), ...fixed.filter(([, v]) => v === 1).map(([i]) => i)],
    });
  } catch (e) {
    if (e instanceof EngineError) throw new HttpError(400, "INVALID_INPUT", e.message);
    throw e;
  }
}

// A perturbation is a view of the model: knocked-out nodes are fixed to 0, over-expressed nodes to 1, and fixed
// input conditions set inputs to a constant; the stored revision itself is never changed.
import type { ModelDefinition } from "../../shared/engine/rules";
import { HttpError } from "../http/errors";

export interface Perturbation {
  knockOut: readonly string[];
  overExpress: readonly string[];
  fixed: Readonly<Record<string, 0 | 1>>;
}

export function perturbedDefinition(model: ModelDefinition, p: Perturbation): ModelDefinition {
  const value = new Map<string, 0 | 1>();
  const set = (name: string, v: 0 | 1) => {
    if (!model.nodes.some((n) => n.name === name)) throw new HttpError(400, "UNKNOWN_NODE", `${name} is not a node of the model`);
    if (value.has(name) && value.get(name) !== v) throw new HttpError(400, "INVALID_INPUT", `${name} cannot be fixed to both 0 and 1`);
    value.set(name, v);
  };
  p.knockOut.forEach((n) => set(n, 0));
  p.overExpress.forEach((n) => set(n, 1));
  Object.entries(p.fixed).forEach(([n, v]) => set(n, v));
  return {
    nodes: model.nodes.map((node) => {
      const v = value.get(node.name);
      return v === undefined ? node : { name: node.name, rule: { kind: "const" as const, value: v } };
    }),
  };
}

// Under asynchronous update a screen row also counts minimal trap spaces of the perturbed model and those that fix
// the phenotype: each holds at least one asynchronous attractor (Klarner, Bockmayr, Siebert, Natural Computing 2015),
// so this is the phenotype's footing under asynchronous update on models of any size the trap-space search takes.
import type { Assignment } from "../expectations";
import type { BooleanNetwork } from "../network";
import { perturbNetwork } from "../perturbation";
import type { ShouldStop } from "../progress";
import { trapSpaces } from "../trap-spaces";

export interface TrapSpaceCount {
  readonly total: number;
  readonly withPhenotype: number;
  /** False when the enumeration stopped at its cap (the counts are then lower bounds). */
  readonly complete: boolean;
}

/** Minimal trap spaces of `net` with the nodes of `perturbation` held, and how many fix every phenotype node. */
export function trapSpacePhenotypeCount(
  net: BooleanNetwork,
  perturbation: Assignment,
  phenotype: Assignment,
  options: { readonly shouldStop?: ShouldStop } = {},
): TrapSpaceCount {
  const index = new Map(net.names.map((name, i) => [name, i]));
  const held = Object.entries(perturbation);
  const perturbed = perturbNetwork(net, {
    knockOut: held.filter(([, v]) => v === 0).map(([name]) => index.get(name)!),
    overExpress: held.filter(([, v]) => v === 1).map(([name]) => index.get(name)!),
  });
  const search = trapSpaces(perturbed, { kind: "minimal", shouldStop: options.shouldStop });
  const wanted = Object.entries(phenotype);
  const withPhenotype = search.trapSpaces.filter((t) => wanted.every(([name, v]) => t.fixed[name] === v)).length;
  return { total: search.trapSpaces.length, withPhenotype, complete: search.complete };
}

// NK ensemble statistics beside one model: the Derrida damage curve of random networks with the model's size and
// mean in-degree, of the model itself, and the annealed approximation (Derrida, Pomeau, Europhysics Letters 1986);
// plus the attractor counts and lengths of the ensemble when its members are small enough to analyse exactly
// (Kauffman, J. Theor. Biol. 1969). Seeded, so the same request draws the same networks; runs in a Web Worker.
import seedrandom from "seedrandom";
import { annealedDamage, attractorStatistics, derridaCurve } from "@shared/engine/ensembles";
import { nkNetwork } from "@shared/engine/generators";
import { compileDefinition, readRuleText } from "@shared/engine/rules";

export const MAX_ENSEMBLE_ATTRACTOR_NODES = 14;
export const DERRIDA_DISTANCES = Array.from({ length: 21 }, (_, i) => i / 20);

export interface EnsembleRequest {
  ruleText: string;
  n: number;
  k: number;
  p: number;
  members: number;
  seed: number;
}

export interface EnsembleSummary {
  request: Omit<EnsembleRequest, "ruleText">;
  curve: { before: number; ensemble: number; model: number; annealed: number }[];
  attractors: { meanCount: number; meanLength: number; countDistribution: [number, number][] } | null;
}

export function ensembleSummary(req: EnsembleRequest): EnsembleSummary {
  const family = (i: number) => nkNetwork({ n: req.n, k: req.k, p: req.p, random: seedrandom(`${req.seed}-${i}`) });
  const networks = Array.from({ length: req.members }, (_, i) => family(i));
  const model = compileDefinition(readRuleText(req.ruleText));
  const opts = { distances: DERRIDA_DISTANCES, pairs: 40 };
  const ensemble = derridaCurve(networks, { ...opts, rng: seedrandom(`${req.seed}-damage`) });
  const own = derridaCurve([model], { ...opts, rng: seedrandom(`${req.seed}-model`) });
  const stats =
    req.n <= MAX_ENSEMBLE_ATTRACTOR_NODES
      ? attractorStatistics(
          family,
          networks.map((_, i) => i),
        )
      : null;
  return {
    request: { n: req.n, k: req.k, p: req.p, members: req.members, seed: req.seed },
    curve: ensemble.map((pt, i) => ({
      before: pt.before,
      ensemble: pt.after,
      model: own[i]!.after,
      annealed: annealedDamage(pt.before, req.k, req.p),
    })),
    attractors: stats && {
      meanCount: stats.meanAttractorCount,
      meanLength: stats.meanAttractorLength,
      countDistribution: stats.countDistribution,
    },
  };
}

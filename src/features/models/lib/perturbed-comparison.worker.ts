// The comparison of a model with and without a perturbation off the page's thread (its cost doubles with every
// node): one request in, the comparison or an error out.
import type { Assignment } from "@shared/engine/expectations";
import { compileDefinition, readRuleText } from "@shared/engine/rules";
import { perturbedComparison } from "./perturbed-comparison";

export interface PerturbedComparisonRequest {
  ruleText: string;
  perturbation: Assignment;
  phenotype: Assignment;
}

self.onmessage = (e: MessageEvent<PerturbedComparisonRequest>) => {
  try {
    const net = compileDefinition(readRuleText(e.data.ruleText));
    self.postMessage({ ok: true, comparison: perturbedComparison(net, e.data.perturbation, e.data.phenotype) });
  } catch (err) {
    self.postMessage({ ok: false, message: err instanceof Error ? err.message : String(err) });
  }
};

// The analyses of large models run on a stored revision only: its rule text was checked when it was stored.
import { RunRequestError } from "../run-errors";

export function revisionRuleText(kind: string, revision: { ruleText: string } | null): string {
  if (!revision?.ruleText)
    throw new RunRequestError(400, "INVALID_INPUT", `A "${kind}" run needs a model revision (modelRevisionId)`);
  return revision.ruleText;
}

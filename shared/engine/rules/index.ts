export type {
  Expr,
  NaryOp,
  NaryExpr,
  ThresholdRule,
  ThresholdTerm,
  RuleSyntax,
  NodeDefinition,
  ModelDefinition,
  SourcePos,
} from "./syntax";
export {
  RESERVED_WORDS,
  PROTOTYPE_KEY,
  isValidNodeName,
  variablesOf,
  stripPositions,
  forEachSubexpression,
  firstTooDeep,
  mapExpr,
} from "./syntax";
export {
  MAX_RULE_TEXT_CHARS,
  MAX_RULE_CHARS,
  MAX_NODES,
  MAX_REGULATORS,
  MAX_NESTING_DEPTH,
  MAX_NAME_CHARS,
  MAX_REPORTED_ERRORS,
} from "./limits";
export { showInput } from "./show-input";
export { ErrorList, firstErrorCounting } from "./error-list";
export { tokenizeLine } from "./tokenizer";
export type { Token, TokenKind } from "./tokenizer";
export { parseRuleText, readRuleText } from "./parse-rule-text";
export type { ParsedRule, RuleTextResult } from "./parse-rule-text";
export { printExpr, printRule, printRuleText } from "./print-rule-text";
export {
  compileDefinition,
  checkDefinition,
  evaluateRule,
  evaluateExpr,
  ruleRegulators,
  truthTableOf,
} from "./compile-definition";
export { minimalSop } from "./minimal-sop";
export type { Cube } from "./minimal-sop";
export { networkToDefinition, tableToExpr } from "./network-to-definition";
export { upgradeDefinition, upgradeExpr } from "./stored-definition";
export type { StoredExpr } from "./stored-definition";

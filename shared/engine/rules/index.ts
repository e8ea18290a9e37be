export type {
  Expr,
  BinaryOp,
  ThresholdRule,
  ThresholdTerm,
  RuleSyntax,
  NodeDefinition,
  ModelDefinition,
  SourcePos,
} from "./syntax";
export { RESERVED_WORDS, isValidNodeName, variablesOf, stripPositions, chainOperands } from "./syntax";
export type { BinaryExpr } from "./syntax";
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

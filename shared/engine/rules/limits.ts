// The explicit bounds every model reader checks before the work they bound (documented in docs/rule-text.md and
// docs/truth-table-csv.md). They keep reading linear in the input and its memory bounded, so that no single text can
// stall whoever reads it; each is far above what published Boolean models need (the largest have a few thousand
// nodes and rarely more than a dozen regulators per node).

/** Characters a whole rule text may have (8 MiB; uploads are refused above 5 MB before they reach a reader). */
export const MAX_RULE_TEXT_CHARS = 8 * 1024 * 1024;

/** Characters one line of rule text may have (4 MiB: a sum of products over 16 regulators prints to about 2 MB). */
export const MAX_RULE_CHARS = 4 * 1024 * 1024;

/** Nodes a model may have. */
export const MAX_NODES = 20_000;

/** Regulators one node may read (its in-degree): its truth table has 2^k rows. */
export const MAX_REGULATORS = 20;

/**
 * How deeply an expression may nest: at most this many `not`s and operators (and, or, xor) on any path from the root
 * of its syntax tree to a leaf, and at most this many parentheses and `not`s open at once in rule text. Long flat
 * chains (`A & B & C & ...`) are one level, however long. The bound keeps every recursive walk and JSON.stringify of a
 * stored definition far from the call-stack limit.
 */
export const MAX_NESTING_DEPTH = 500;

/** Characters a node name may have. */
export const MAX_NAME_CHARS = 256;

/** Errors a reader lists; it counts the ones beyond (its result's `moreErrors`) but does not keep them. */
export const MAX_REPORTED_ERRORS = 100;

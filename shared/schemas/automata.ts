// The block-emulation hierarchy of the elementary cellular automata as the API reads and answers it.
import { z } from "zod";

/** Block sizes up to this are computed inline by a request (the full hierarchy takes under 5 s); above, by a run. */
export const INLINE_MAX_BLOCK = 11;
/** The largest block size a hierarchy may have (the engine's bound for a background job). */
export const MAX_HIERARCHY_BLOCK = 18;

/**
 * "block": F runs exactly k steps per step of G (t = k, the classical definition). The table also admits "any"
 * (any 1 <= t <= k) for when the engine's hierarchy covers other time scales; the API accepts only "block" today.
 */
export const TimeMode = z.enum(["block"], {
  error: 'timeMode must be "block" (t = k steps of the emulator per step); other time scales are not computed yet',
});
export type TimeMode = z.infer<typeof TimeMode>;

const intParam = (name: string, min: number, max: number) =>
  z
    .string({ error: `${name} is required` })
    .regex(/^\d+$/, `${name} must be a whole number`)
    .transform(Number)
    .pipe(z.number().int().min(min, `${name} must be at least ${min}`).max(max, `${name} must be at most ${max}`));

const ruleParam = (name: string) => intParam(name, 0, 255).describe(`${name}: an elementary rule number 0..255`);

export const HierarchyParameters = z.object({
  maxBlock: intParam("maxBlock", 1, MAX_HIERARCHY_BLOCK).default(INLINE_MAX_BLOCK),
  timeMode: TimeMode.default("block"),
  radius: z
    .string()
    .refine((v) => v === "1", "radius must be 1: hierarchies are computed between elementary (radius-1) rules")
    .transform(Number)
    .default(1),
});
export type HierarchyParameters = z.infer<typeof HierarchyParameters>;

/** The same parameters as plain numbers, for run bodies (JSON rather than a query string). */
export const HierarchyRunParameters = z.object({
  maxBlock: z.number().int().min(1).max(MAX_HIERARCHY_BLOCK),
  timeMode: TimeMode.default("block"),
  radius: z.literal(1).default(1),
});
export type HierarchyRunParameters = z.infer<typeof HierarchyRunParameters>;

export const HierarchyQuery = HierarchyParameters.strict();
export const RuleParams = z.object({ rule: ruleParam("rule") });
export const RuleQuery = HierarchyParameters.strict();
export const WitnessQuery = HierarchyParameters.extend({
  source: ruleParam("source"),
  target: ruleParam("target"),
}).strict();

const Word = z.string().regex(/^[01]+$/);
export const Witness = z.object({
  time: z.number().int().min(1),
  encoding: z.object({ "0": Word, "1": Word }),
  /** Present when the pair holds only through a chain source, ..., target whose witnesses were composed. */
  via: z.array(z.number().int()).optional(),
});
export type Witness = z.infer<typeof Witness>;

/** One pair of the relation: `source` emulates `target`, first with block size `minBlock`. */
export const HierarchyPair = z.object({
  source: z.number().int(),
  target: z.number().int(),
  minBlock: z.number().int(),
  time: z.number().int(),
  /** True when the pair holds only by composing other pairs (its block size is then a product). */
  composed: z.boolean(),
});
export type HierarchyPair = z.infer<typeof HierarchyPair>;

export const HierarchyPairWithWitness = z.object({
  source: z.number().int(),
  target: z.number().int(),
  minBlock: z.number().int(),
  witness: Witness,
});
export type HierarchyPairWithWitness = z.infer<typeof HierarchyPairWithWitness>;

export const HierarchySummary = z.object({
  id: z.string(),
  maxBlock: z.number().int(),
  timeMode: TimeMode,
  radius: z.number().int(),
  pairCount: z.number().int(),
  computedAt: z.string(),
  durationMs: z.number().int(),
  computedBy: z.object({ id: z.string(), displayName: z.string() }).nullable(),
  runId: z.string().nullable(),
});
export type HierarchySummary = z.infer<typeof HierarchySummary>;

export const Hierarchy = HierarchySummary.extend({
  /**
   * Every pair that holds for some block size up to maxBlock, the identity pairs (k = 1) included, plus the pairs
   * of the transitive closure that hold only through composition (composed: true, block size a product).
   */
  pairs: z.array(HierarchyPair),
  /** Rules with no emulation at all (not even of themselves) at any block size 2 <= k <= maxBlock. */
  emulateNothing: z.array(z.number().int()),
  /** Classes of the 256 rules under reflection and 0/1 complement, each sorted, ordered by least member. */
  symmetryClasses: z.array(z.array(z.number().int())),
  /** True when this request computed the hierarchy (it was not stored before). */
  computedNow: z.boolean(),
});
export type Hierarchy = z.infer<typeof Hierarchy>;

export const RuleEmulations = z.object({
  rule: z.number().int(),
  maxBlock: z.number().int(),
  timeMode: TimeMode,
  symmetryClass: z.array(z.number().int()),
  /** Rules this one emulates, with the least block size and a witness. */
  emulates: z.array(HierarchyPairWithWitness),
  /** Rules that emulate this one. */
  emulatedBy: z.array(HierarchyPairWithWitness),
});
export type RuleEmulations = z.infer<typeof RuleEmulations>;

/** One of the eight checks: F run t steps on u_a u_b u_c must leave u_{G(a,b,c)} in the middle. */
export const WitnessCheck = z.object({
  neighbourhood: z.string().regex(/^[01]{3}$/),
  expectedBit: z.union([z.literal(0), z.literal(1)]),
  input: Word,
  expected: Word,
  obtained: Word,
  agrees: z.boolean(),
});
export type WitnessCheck = z.infer<typeof WitnessCheck>;

export const WitnessReport = z.object({
  source: z.number().int(),
  target: z.number().int(),
  minBlock: z.number().int(),
  witness: Witness,
  /** The engine's independent verifier's verdict. */
  verified: z.boolean(),
  checks: z.array(WitnessCheck),
});
export type WitnessReport = z.infer<typeof WitnessReport>;

export const HierarchyNotStoredDetails = z.object({
  maxBlock: z.number().int(),
  timeMode: TimeMode,
  radius: z.number().int(),
  inlineMaxBlock: z.number().int(),
});

/** What a background "eca-hierarchy" run produces; the automata routes store it in eca_hierarchies. */
export const HierarchyRunResult = z.object({
  maxBlock: z.number().int(),
  timeMode: TimeMode,
  radius: z.number().int(),
  pairs: z.array(HierarchyPairWithWitness),
  emulateNothing: z.array(z.number().int()),
  /** Wall time of the computation itself, summed over shards. */
  computeMs: z.number(),
});
export type HierarchyRunResult = z.infer<typeof HierarchyRunResult>;

// What the reduction page draws, computed from the certificate alone (so the picture shows exactly what was proven):
// which source node carries which target node, and the two runs side by side, the source run sampled every t steps.
import { networkFromCertificate } from "@shared/engine/certificates";
import type { BooleanNetwork } from "@shared/engine/network";
import { networkToDefinition, printExpr, printRuleText, tableToExpr } from "@shared/engine/rules";
import { bytesFromString, bytesToString, synchronousStep } from "@shared/engine/update";
import type { Certificate } from "@shared/schemas/reductions";
import { CONTEXT_COLOURS, QUALITATIVE } from "@/components/graph/palette";

/** The colour-blind-safe palette without its black, which would read as a context node set to 1; more blocks than
 * colours reuse them (the codeword table names them anyway). */
export const BLOCK_COLOURS: readonly string[] = QUALITATIVE.filter((c) => c !== "#000000");
export const CONTEXT_COLOUR = CONTEXT_COLOURS;

export interface SourceNodeRole {
  block: number | null;
  targetName: string | null;
  contextValue: 0 | 1 | null;
  colour: string;
}

/** For each source node, the target node it helps encode (block emulation), or its fixed context value. */
export function sourceNodeRoles(cert: Certificate): Map<string, SourceNodeRole> {
  const roles = new Map<string, SourceNodeRole>();
  for (const node of cert.source.nodes)
    roles.set(node.name, { block: null, targetName: null, contextValue: null, colour: "#94a3b8" });
  if (cert.notion === "block-emulation") {
    cert.witness.blocks.forEach((b, j) => {
      for (const name of b.nodes)
        roles.set(name, {
          block: j,
          targetName: b.target,
          contextValue: null,
          colour: BLOCK_COLOURS[j % BLOCK_COLOURS.length]!,
        });
    });
    for (const [name, value] of Object.entries(cert.witness.context)) {
      roles.set(name, { block: null, targetName: null, contextValue: value, colour: CONTEXT_COLOUR[value] });
    }
  }
  if (cert.notion === "constant-percolation")
    for (const [name, value] of Object.entries(cert.witness.fixed))
      roles.set(name, { block: null, targetName: null, contextValue: value, colour: CONTEXT_COLOUR[value] });
  if (cert.notion === "node-elimination" || cert.notion === "constant-percolation") {
    // The kept nodes are the target's nodes under the same names.
    cert.target.nodes.forEach((node, j) =>
      roles.set(node.name, {
        block: j,
        targetName: node.name,
        contextValue: null,
        colour: BLOCK_COLOURS[j % BLOCK_COLOURS.length]!,
      }),
    );
  }
  if (cert.notion === "coarse-graining") {
    cert.witness.observables.forEach((o, j) => {
      for (const name of o.inputs)
        roles.set(name, {
          block: j,
          targetName: o.target,
          contextValue: null,
          colour: BLOCK_COLOURS[j % BLOCK_COLOURS.length]!,
        });
    });
  }
  return roles;
}

function encode(cert: Certificate, source: BooleanNetwork, targetState: string): string | null {
  if (cert.notion === "dynamical-embedding") return cert.witness.map[targetState] ?? null;
  if (cert.notion !== "block-emulation") return null;
  const values = new Map<string, string>();
  for (const [name, v] of Object.entries(cert.witness.context)) values.set(name, String(v));
  cert.witness.blocks.forEach((b, j) => {
    const word = targetState[j] === "1" ? b.one : b.zero;
    b.nodes.forEach((name, i) => values.set(name, word[i]!));
  });
  return source.names.map((name) => values.get(name) ?? "0").join("");
}

function observe(
  cert: Extract<Certificate, { notion: "coarse-graining" }>,
  source: BooleanNetwork,
  state: string,
): string {
  const index = new Map(source.names.map((n, i) => [n, i] as const));
  return cert.witness.observables
    .map((o) => {
      let row = 0;
      o.inputs.forEach((name, j) => {
        if (state[index.get(name)!] === "1") row |= 1 << j;
      });
      return o.table[row]!;
    })
    .join("");
}

export interface PairedStep {
  step: number;
  target: string;
  source: string;
  expected: string;
  agrees: boolean;
}

/**
 * G's run from `targetStart` beside F's run from the encoded state, F sampled every t steps. For a coarse-graining the
 * source run starts from `sourceStart` and G's run from its observed image; `expected` is then the observation.
 */
export function pairedRuns(cert: Certificate, start: string, steps: number): PairedStep[] {
  const source = networkFromCertificate(cert.source);
  const target = networkFromCertificate(cert.target);
  const stepTimes = (net: BooleanNetwork, state: string, times: number) => {
    let s = bytesFromString(state);
    for (let i = 0; i < times; i++) s = synchronousStep(net, s);
    return bytesToString(s);
  };
  const out: PairedStep[] = [];
  if (cert.notion === "coarse-graining") {
    let f = start;
    let g = observe(cert, source, f);
    for (let i = 0; i <= steps; i++) {
      const seen = observe(cert, source, f);
      out.push({ step: i, target: g, source: f, expected: seen, agrees: seen === g });
      f = stepTimes(source, f, cert.time);
      g = stepTimes(target, g, 1);
    }
    return out;
  }
  let g = start;
  let f = encode(cert, source, g) ?? "";
  for (let i = 0; i <= steps; i++) {
    const expected = encode(cert, source, g) ?? "";
    out.push({ step: i, target: g, source: f, expected, agrees: expected === f });
    g = stepTimes(target, g, 1);
    f = stepTimes(source, f, cert.time);
  }
  return out;
}

/** G's rules as rule text, one line per node, from the certificate's truth tables. */
export function targetRuleText(cert: Certificate): string {
  return printRuleText(networkToDefinition(networkFromCertificate(cert.target))).trimEnd();
}

type Observable = Extract<Certificate, { notion: "coarse-graining" }>["witness"]["observables"][number];

/**
 * One observable of a coarse-graining in words: which of F's nodes it reads and when it is 1, as the shortest
 * sum-of-products formula of its truth table (the table itself stays in the encoding table for checking).
 */
export function observableInWords(o: Observable): string {
  const table = Uint8Array.from(o.table, (c) => (c === "1" ? 1 : 0));
  const expr = tableToExpr(table, o.inputs);
  if (expr.kind === "const") return `${o.target} is always ${expr.value}, whatever F does`;
  if (expr.kind === "var") return `${o.target} is 1 exactly when ${expr.name} is 1 (it copies ${expr.name})`;
  if (expr.kind === "not" && expr.arg.kind === "var")
    return `${o.target} is 1 exactly when ${expr.arg.name} is 0 (the opposite of ${expr.arg.name})`;
  const read =
    o.inputs.length === 1 ? o.inputs[0] : `${o.inputs.slice(0, -1).join(", ")} and ${o.inputs[o.inputs.length - 1]}`;
  return `${o.target} reads ${read} and is 1 exactly when ${printExpr(expr)} (& and, | or, ! not)`;
}

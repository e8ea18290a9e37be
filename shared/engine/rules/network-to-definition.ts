// Turns any compiled network back into a source-level model, so that generated or imported tables can be printed
// as rule text: each node becomes a sum of products of its regulators (see minimal-sop.ts).
import type { BooleanNetwork } from "../network";
import { minimalSop, type Cube } from "./minimal-sop";
import type { Expr, ModelDefinition } from "./syntax";

function cubeToExpr(cube: Cube, names: readonly string[]): Expr {
  const literals: Expr[] = [];
  for (let j = 0; j < names.length; j++) {
    if (!(cube.mask & (1 << j))) continue;
    const v: Expr = { kind: "var", name: names[j]! };
    literals.push(cube.value & (1 << j) ? v : { kind: "not", arg: v });
  }
  if (literals.length === 0) return { kind: "const", value: 1 };
  return literals.length === 1 ? literals[0]! : { kind: "and", args: literals };
}

/** The Boolean expression of one truth table over named inputs (row bit j = input j): at most three levels deep. */
export function tableToExpr(table: Uint8Array, inputNames: readonly string[]): Expr {
  const cubes = minimalSop(table, inputNames.length);
  if (cubes.length === 0) return { kind: "const", value: 0 };
  if (cubes.length === 1) return cubeToExpr(cubes[0]!, inputNames);
  return { kind: "or", args: cubes.map((c) => cubeToExpr(c, inputNames)) };
}

/** A model whose rules compute exactly the network's tables (regulators that never matter drop out). */
export function networkToDefinition(net: BooleanNetwork): ModelDefinition {
  return {
    nodes: net.names.map((name, i) => ({
      name,
      rule: tableToExpr(
        net.tables[i]!,
        Array.from(net.regulators[i]!, (r) => net.names[r]!),
      ),
    })),
  };
}

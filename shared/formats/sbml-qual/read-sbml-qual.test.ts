import { readFileSync } from "node:fs";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { EngineError, ParseError } from "../../engine/errors";
import type { BooleanNetwork } from "../../engine/network";
import { compileDefinition, firstTooDeep, printRuleText, readRuleText, type Expr } from "../../engine/rules";
import { modelArb } from "../../engine/rules/rules-arbitrary.test-support";
import { readSbmlQual } from "./read-sbml-qual";
import { writeSbmlQual } from "./write-sbml-qual";

const fixture = (name: string) =>
  readFileSync(new URL(`../../../tests/fixtures/sbml/${name}`, import.meta.url), "utf8");

function nextState(net: BooleanNetwork, s: number): number {
  let t = 0;
  net.names.forEach((_, i) => {
    let row = 0;
    net.regulators[i]!.forEach((r, j) => (row |= ((s >> r) & 1) << j));
    t |= net.tables[i]![row]! << i;
  });
  return t;
}

function sameDynamics(a: BooleanNetwork, b: BooleanNetwork): void {
  expect(b.names).toEqual(a.names);
  for (let s = 0; s < 1 << a.names.length; s++) expect(nextState(b, s)).toBe(nextState(a, s));
}

/** Synchronous attractors by following every state until it repeats (plain reference). */
function synchronousAttractors(net: BooleanNetwork): { states: number[]; basin: number }[] {
  const found = new Map<number, { states: number[]; basin: number }>();
  for (let s = 0; s < 1 << net.names.length; s++) {
    const seen = new Set<number>();
    let x = s;
    while (!seen.has(x)) (seen.add(x), (x = nextState(net, x)));
    const cycle = [x];
    for (let y = nextState(net, x); y !== x; y = nextState(net, y)) cycle.push(y);
    const key = Math.min(...cycle);
    const entry = found.get(key) ?? { states: cycle, basin: 0 };
    entry.basin++;
    found.set(key, entry);
  }
  return [...found.values()];
}

/** Terminal strongly connected components of the general asynchronous graph (one node flips per step). */
function asynchronousAttractors(net: BooleanNetwork): number[][] {
  const n = net.names.length;
  const size = 1 << n;
  const succ = (s: number) => {
    const t = nextState(net, s);
    const out: number[] = [];
    for (let i = 0; i < n; i++) if (((s ^ t) >> i) & 1) out.push(s ^ (1 << i));
    return out;
  };
  // Reachability closure is small enough at 1024 states: a state is in a terminal SCC iff every state it reaches
  // can reach it back.
  const reach = (s: number) => {
    const seen = new Set([s]);
    const stack = [s];
    while (stack.length) for (const t of succ(stack.pop()!)) if (!seen.has(t)) (seen.add(t), stack.push(t));
    return seen;
  };
  const reachable = Array.from({ length: size }, (_, s) => reach(s));
  const inTerminal = (s: number) => [...reachable[s]!].every((t) => reachable[t]!.has(s));
  const done = new Set<number>();
  const result: number[][] = [];
  for (let s = 0; s < size; s++) {
    if (done.has(s) || !inTerminal(s)) continue;
    const component = [...reachable[s]!].sort((a, b) => a - b);
    component.forEach((t) => done.add(t));
    result.push(component);
  }
  return result;
}

const wrap = (species: string, transitions: string) => `<?xml version="1.0" encoding="UTF-8"?>
<sbml xmlns="http://www.sbml.org/sbml/level3/version1/core" level="3" version="1"
      xmlns:qual="http://www.sbml.org/sbml/level3/version1/qual/version1" qual:required="true"
      xmlns:layout="http://www.sbml.org/sbml/level3/version1/layout/version1" layout:required="false">
  <model id="toy">
    <listOfCompartments><compartment id="c" constant="true"/></listOfCompartments>
    <qual:listOfQualitativeSpecies>${species}</qual:listOfQualitativeSpecies>
    <qual:listOfTransitions>${transitions}</qual:listOfTransitions>
    <layout:listOfLayouts><layout:layout layout:id="l1"><layout:dimensions layout:width="10" layout:height="10"/>
      <layout:listOfAdditionalGraphicalObjects><layout:generalGlyph layout:id="g1" layout:reference="A"/></layout:listOfAdditionalGraphicalObjects>
    </layout:layout></layout:listOfLayouts>
  </model>
</sbml>`;
const sp = (id: string, extra = "") =>
  `<qual:qualitativeSpecies qual:id="${id}" qual:compartment="c" qual:constant="false" qual:maxLevel="1" ${extra}/>`;
const tr = (id: string, out: string, terms: string, defaultLevel = 0, inputs = "") => `<qual:transition qual:id="${id}">
  <qual:listOfInputs>${inputs}</qual:listOfInputs>
  <qual:listOfOutputs><qual:output qual:qualitativeSpecies="${out}" qual:transitionEffect="assignmentLevel"/></qual:listOfOutputs>
  <qual:listOfFunctionTerms><qual:defaultTerm qual:resultLevel="${defaultLevel}"/>${terms}</qual:listOfFunctionTerms>
</qual:transition>`;
const term = (level: number, math: string) =>
  `<qual:functionTerm qual:resultLevel="${level}"><math xmlns="http://www.w3.org/1998/Math/MathML">${math}</math></qual:functionTerm>`;
const rel = (op: string, a: string, b: string) => `<apply><${op}/>${a}${b}</apply>`;
const ci = (x: string) => `<ci> ${x} </ci>`;
const cn = (v: number) => `<cn type="integer">${v}</cn>`;

describe("readSbmlQual", () => {
  it("readSbmlQual reads the libSBML-written cell-cycle file into the same rules as the rule-text fixture", () => {
    const imported = readSbmlQual(fixture("faure-2006-cell-cycle.libsbml.sbml"));
    const expected = compileDefinition(readRuleText(fixture("faure-2006-cell-cycle.rules")));
    sameDynamics(expected, compileDefinition(imported.definition));
    expect(imported.modelId).toBe("faure2006_cell_cycle");
    expect(imported.initialLevels).toMatchObject({ Rb: 1, p27: 1, Cdh1: 1, CycD: 0, CycB: 0 });
    expect(imported.definition.nodes[0]).toEqual({ name: "CycD", rule: { kind: "var", name: "CycD" } });
  });

  it("readSbmlQual of the cell-cycle model gives the published attractors under both update schemes", () => {
    // Faure, Naldi, Chaouiya, Thieffry, Bioinformatics 2006 (rules and results from memory): synchronous update has
    // one fixed point (the quiescent state, CycD = 0, with Rb, p27 and Cdh1 on) and one cycle of length 7 (CycD = 1);
    // asynchronous update has the same fixed point and one complex cyclic attractor.
    const net = compileDefinition(readSbmlQual(fixture("faure-2006-cell-cycle.libsbml.sbml")).definition);
    const on = (s: number) => net.names.filter((_, i) => (s >> i) & 1);
    const sync = synchronousAttractors(net).sort((a, b) => a.states.length - b.states.length);
    expect(sync.map((a) => a.states.length)).toEqual([1, 7]);
    expect(on(sync[0]!.states[0]!)).toEqual(["Rb", "p27", "Cdh1"]);
    expect(sync[1]!.states.every((s) => s & 1)).toBe(true);
    const asyncAttractors = asynchronousAttractors(net).sort((a, b) => a.length - b.length);
    expect(asyncAttractors).toHaveLength(2);
    expect(asyncAttractors[0]).toEqual([sync[0]!.states[0]]);
    expect(asyncAttractors[1]!.length).toBeGreaterThan(7);
    expect(asyncAttractors[1]!.every((s) => s & 1)).toBe(true);
  });

  it("readSbmlQual refuses a multi-valued species and names it", () => {
    expect(() => readSbmlQual(fixture("multivalued.libsbml.sbml"))).toThrow(
      /species Kinase has maxLevel 2; Emulant reads Boolean models only \(maxLevel 1\), so multi-valued species must be made Boolean first \(line 9, column 7\)$/,
    );
  });

  it("readSbmlQual reads every supported MathML operator and ignores the layout package", () => {
    const species = ["A", "B", "R1", "R2", "R3", "R4", "R5", "R6", "R7", "R8"].map((x) => sp(x)).join("");
    const text = wrap(
      species,
      [
        tr("t1", "R1", term(1, rel("implies", rel("eq", ci("A"), cn(1)), rel("eq", ci("B"), cn(1))))),
        tr("t2", "R2", term(1, rel("neq", ci("A"), ci("B")))),
        tr("t3", "R3", term(1, rel("gt", ci("A"), ci("B")))),
        tr("t4", "R4", term(1, rel("leq", ci("A"), cn(0)))),
        tr(
          "t5",
          "R5",
          term(1, `<apply><xor/>${rel("geq", ci("A"), cn(1))}${rel("lt", ci("B"), cn(1))}<true/></apply>`),
        ),
        tr("t6", "R6", term(1, `<apply><or/><false/>${rel("eq", cn(1), ci("A"))}</apply>`)),
        // first matching term wins: on when A, else off when B, else the default 1
        tr("t7", "R7", term(1, rel("eq", ci("A"), cn(1))) + term(0, rel("eq", ci("B"), cn(1))), 1),
        tr(
          "t8",
          "R8",
          term(1, rel("geq", ci("A"), ci("thA"))),
          0,
          `<qual:input qual:id="thA" qual:qualitativeSpecies="A" qual:transitionEffect="none" qual:thresholdLevel="1"/>`,
        ),
      ].join(""),
    );
    const net = compileDefinition(readSbmlQual(text).definition);
    const expected = compileDefinition(
      readRuleText(
        "A' = A\nB' = B\nR1' = !A | B\nR2' = A ^ B\nR3' = A & !B\nR4' = !A\nR5' = !(A ^ !B)\nR6' = A\nR7' = A | !B\nR8' = A\n",
      ),
    );
    sameDynamics(expected, net);
  });

  it("readSbmlQual keeps constant species and species without a transition at their value, and reads names and initial levels", () => {
    const text = wrap(
      sp("A", 'qual:initialLevel="1" qual:name="Antigen &amp; co"') +
        sp("K").replace('constant="false"', 'constant="true"') +
        sp("B"),
      tr("tK", "K", term(1, "<true/>")) + tr("tB", "B", term(1, rel("eq", ci("A"), cn(0)))),
    );
    const model = readSbmlQual(text);
    expect(printRuleText(model.definition)).toBe("A' = A\nK' = K\nB' = !A\n");
    expect(model.warnings).toEqual(["species K is constant, so tK is not used"]);
    expect(model.initialLevels).toEqual({ A: 1 });
    expect(model.speciesNames).toEqual({ A: "Antigen & co" });
  });

  it("readSbmlQual reports XML syntax errors with line and column, and refuses DTDs", () => {
    const broken = '<?xml version="1.0"?>\n<sbml level="3">\n  <model>\n</sbml>';
    try {
      readSbmlQual(broken);
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(ParseError);
      expect((e as ParseError).line).toBe(4);
      expect((e as ParseError).reason).toMatch(/XML syntax error: Expected closing tag 'model'/);
    }
    expect(() => readSbmlQual('<?xml version="1.0"?>\n<!DOCTYPE sbml [<!ENTITY x "y">]>\n<sbml/>')).toThrow(
      /DOCTYPE declarations are not accepted in model files \(line 2, column 1\)/,
    );
  });

  it("readSbmlQual names the transition when its math is outside the Boolean subset or names an unknown id", () => {
    const species = sp("A") + sp("B");
    expect(() =>
      readSbmlQual(wrap(species, tr("tB", "B", term(1, `<apply><plus/>${ci("A")}${cn(1)}</apply>`)))),
    ).toThrow(/transition tB: MathML <plus> is not part of the Boolean subset Emulant reads \(line 11, column 165\)$/);
    expect(() => readSbmlQual(wrap(species, tr("tB", "B", term(1, rel("eq", ci("Z"), cn(1))))))).toThrow(
      /transition tB: <ci>Z<\/ci> names neither/,
    );
    expect(() =>
      readSbmlQual(wrap(species, tr("tB", "B", term(1, ci("A"))) + tr("tB2", "B", term(1, "<true/>")))),
    ).toThrow(/species B is the output of two transitions \(tB and tB2\)/);
    expect(() => readSbmlQual(wrap(species, tr("tB", "B", term(3, "<true/>"))))).toThrow(EngineError);
    expect(() => readSbmlQual('<?xml version="1.0"?><sbml level="2" version="4"><model/></sbml>')).toThrow(
      /needs SBML Level 3/,
    );
  });

  it("readSbmlQual refuses files above the size limit before parsing", () => {
    expect(() => readSbmlQual("<sbml>" + " ".repeat(20 * 1024 * 1024) + "</sbml>")).toThrow(/larger than 20 MiB/);
  });

  it("readSbmlQual(writeSbmlQual(m)) has the same dynamics as m for random models", () => {
    fc.assert(
      fc.property(modelArb(), (model) => {
        const back = readSbmlQual(writeSbmlQual(model, { modelId: "random model" }));
        sameDynamics(compileDefinition(model), compileDefinition(back.definition));
      }),
      { seed: 4801, numRuns: 200 },
    );
  });

  it("readSbmlQual reports every model error as a ParseError at the element it concerns", () => {
    const at = (text: string) => {
      try {
        readSbmlQual(text);
      } catch (e) {
        if (!(e instanceof ParseError)) throw e;
        return [e.code, e.line, e.reason];
      }
      return null;
    };
    const species = sp("A") + sp("B");
    expect(at(wrap(species, tr("tB", "B", term(1, rel("eq", ci("Z"), cn(1))))))).toEqual([
      "SBML_MATH",
      11,
      "transition tB: <ci>Z</ci> names neither a qualitative species nor an input",
    ]);
    expect(at(wrap(sp("A") + sp("A"), ""))).toEqual(["SBML_ERROR", 7, "species A is declared twice (first at line 7)"]);
    expect(at(wrap(sp("A", 'qual:initialLevel="99999999999999999999"'), ""))?.[2]).toBe(
      'initialLevel of species A must be a non-negative integer, found "99999999999999999999"',
    );
    expect(at(wrap(sp("__proto__"), ""))?.[2]).toBe("species id __proto__ cannot be a node name");
    expect(at(wrap(sp("N".repeat(300)), ""))?.[2]).toBe(
      "a species id has 300 characters; a node name may have at most 256",
    );
    expect(at(wrap(sp("A&#0;"), ""))?.[2]).toMatch(/^species id "A\\u0000" cannot be a node name/);
  });

  it("readSbmlQual refuses an unknown element inside the qual lists instead of dropping what it holds", () => {
    const species = sp("A") + sp("B");
    const misspelt = tr("tB", "B", term(1, rel("eq", ci("A"), cn(1)))).replace(/functionTerm /, "functionterm ");
    expect(() => readSbmlQual(wrap(species, misspelt.replace("</qual:functionTerm>", "</qual:functionterm>")))).toThrow(
      /unknown element <functionterm> in <listOfFunctionTerms>; expected <defaultTerm> or <functionTerm> \(line 11, column \d+\)$/,
    );
    expect(() => readSbmlQual(wrap(species + "<qual:species/>", ""))).toThrow(
      /unknown element <species> in <listOfQualitativeSpecies>; expected <qualitativeSpecies>/,
    );
    const annotated = tr("tB", "B", term(1, rel("eq", ci("A"), cn(1)))).replace(
      "<qual:listOfInputs>",
      "<annotation><x/></annotation><notes/><qual:listOfInputs>",
    );
    expect(printRuleText(readSbmlQual(wrap(species, annotated)).definition)).toBe("A' = A\nB' = A\n");
  });

  it("readSbmlQual keeps a long list of function terms shallow, and refuses terms that alternate too deeply", () => {
    const species = ["A", "B", "C"].map((x) => sp(x)).join("");
    const on = term(1, rel("eq", ci("A"), cn(1)));
    const off = term(0, rel("eq", ci("B"), cn(1)));
    const many = readSbmlQual(wrap(species, tr("tC", "C", on.repeat(5000)))).definition;
    const rule = many.nodes[2]!.rule;
    expect(rule.kind === "or" && rule.args.length).toBe(5000);
    expect(firstTooDeep(rule as Expr, 1)).toBeNull();
    const alternating = (n: number) => wrap(species, tr("tC", "C", (on + off).repeat(n)));
    expect(readSbmlQual(alternating(200)).definition.nodes).toHaveLength(3);
    expect(() => readSbmlQual(alternating(300))).toThrow(
      /transition tC: its function terms nest more than 500 levels deep \(line 8, column 29\)$/,
    );
  });

  it("readSbmlQual refuses a transition that reads more than 20 species, naming it", () => {
    const ids = Array.from({ length: 21 }, (_, i) => `s${i}`);
    const math = `<apply><or/>${ids.map((x) => rel("eq", ci(x), cn(1))).join("")}</apply>`;
    expect(() => readSbmlQual(wrap(ids.map((x) => sp(x)).join(""), tr("t", "s0", term(1, math))))).toThrow(
      /transition t reads 21 species; a node may read at most 20/,
    );
  });

  it("readSbmlQual gives names and initial levels as objects without a prototype", () => {
    const model = readSbmlQual(wrap(sp("toString", 'qual:initialLevel="1"') + sp("valueOf"), ""));
    expect(Object.getPrototypeOf(model.initialLevels)).toBeNull();
    expect(Object.keys(model.initialLevels)).toEqual(["toString"]);
    expect(model.initialLevels["valueOf"]).toBeUndefined();
    expect(model.definition.nodes.map((n) => n.name)).toEqual(["toString", "valueOf"]);
  });
});

import { describe, expect, it } from "vitest";
import { readRuleText } from "../../engine/rules";
import { parseXml, childNamed, childrenNamed } from "./xml-tree";
import { writeSbmlQual } from "./write-sbml-qual";

describe("writeSbmlQual", () => {
  const text = writeSbmlQual(
    readRuleText("In' = In\nOn' = 1\nX' = In & !Y | X ^ In\nY' = threshold(+1 In, -1 X; tie zero)\n"),
    { modelId: "3 genes", modelName: "A & B" },
  );
  const model = childNamed(parseXml(text), "model")!;
  const transitions = childrenNamed(childNamed(model, "listOfTransitions")!, "transition");

  it("writeSbmlQual declares SBML Level 3 Version 1 with the qual package required", () => {
    expect(text).toMatch(
      /<sbml xmlns="http:\/\/www.sbml.org\/sbml\/level3\/version1\/core" level="3" version="1" xmlns:qual="http:\/\/www.sbml.org\/sbml\/level3\/version1\/qual\/version1" qual:required="true">/,
    );
    expect(model.attrs).toEqual({ id: "m_3_genes", name: "A & B" });
  });

  it("writeSbmlQual leaves inputs without a transition and writes a constant as the default level alone", () => {
    expect(transitions.map((t) => t.attrs["id"])).toEqual(["tr_On", "tr_X", "tr_Y"]);
    const onTerms = childNamed(transitions[0]!, "listOfFunctionTerms")!;
    expect(onTerms.children.map((c) => [c.name, c.attrs["resultLevel"]])).toEqual([["defaultTerm", "1"]]);
  });

  it("writeSbmlQual signs each input by its effect on the rule: positive, negative or dual", () => {
    const signs = (t: number) =>
      childrenNamed(childNamed(transitions[t]!, "listOfInputs")!, "input").map((i) => [
        i.attrs["qualitativeSpecies"],
        i.attrs["sign"],
      ]);
    // X' = In & !Y | X ^ In: raising In can switch X off (when X = 1, Y = 1), and on (X = 0, Y = 0): dual
    expect(signs(1)).toEqual([
      ["In", "dual"],
      ["X", "dual"],
      ["Y", "negative"],
    ]);
    expect(signs(2)).toEqual([
      ["In", "positive"],
      ["X", "negative"],
    ]);
  });
});

// Composition of block emulations (Delorme et al., "Bulking I", Theor. Comput. Sci. 412, 2011): if F emulates G
// with codewords u0, u1 (block k, time t) and G emulates H with v0, v1 (block j, time s), then F emulates H at block
// k*j and time t*s with codeword U_b = u_{v_b[0]} u_{v_b[1]} ... u_{v_b[j-1]}: each t steps of F on a row of
// u-blocks act as one step of G on the decoded row.
import { EngineError } from "../errors";

export interface CodewordPair {
  readonly u0: string;
  readonly u1: string;
}

export function composeWitnesses(outer: CodewordPair, inner: CodewordPair): CodewordPair {
  if (outer.u0.length !== outer.u1.length || inner.u0.length !== inner.u1.length) {
    throw new EngineError("BAD_WORD", "codewords of one witness must have equal lengths");
  }
  const encode = (v: string) => {
    let out = "";
    for (const ch of v) {
      if (ch !== "0" && ch !== "1") throw new EngineError("BAD_WORD", `a codeword is made of 0 and 1, got "${v}"`);
      out += ch === "1" ? outer.u1 : outer.u0;
    }
    return out;
  };
  return { u0: encode(inner.u0), u1: encode(inner.u1) };
}

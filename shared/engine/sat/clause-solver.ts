// A numeric-clause handle on the MiniSat build inside logic-solver 2.0.1 (Eén, Sörensson, "An extensible
// SAT-solver", SAT 2003). logic-solver's formula layer costs tens of microseconds per clause, so the large encodings
// (fixed points, trap spaces, closure of observables) write clauses over numbered variables straight to its MiniSat
// instance; only the pinned version's internals are relied on. MiniSat here takes one assumption per call, so a
// temporary group of clauses is guarded by an activation variable: assume it for a call, retire it to drop the group.
// Each instance has a fixed 64 MB heap (the build cannot grow it), about 10^7 clause literals; running out aborts
// the instance, which is reported as an EngineError with code SOLVER_MEMORY.
import Logic from "logic-solver";
import { EngineError } from "../errors";

interface MiniSatInternals {
  addClause(terms: number[]): boolean;
  ensureVar(v: number): void;
  solve(): boolean;
  solveAssuming(v: number): boolean;
  getSolution(): (boolean | null)[];
  retireVar(v: number): void;
  _clauses: unknown[];
}

export class ClauseSolver {
  private readonly sat: MiniSatInternals;
  // Numbers 1 and 2 are logic-solver's constants; ours start after them.
  private nextVar = 3;
  private unsat = false;

  constructor() {
    this.sat = (new Logic.Solver() as unknown as { _minisat: MiniSatInternals })._minisat;
    // The wrapper keeps a copy of every clause for its own debugging; on encodings of 10^5 clauses that copy is
    // pure memory, so it is made a sink.
    this.sat._clauses = { push: () => 0 } as unknown as unknown[];
  }

  newVar(): number {
    return this.nextVar++;
  }

  /** Add a clause of signed variable numbers (negative = negated). An empty clause makes the problem UNSAT. */
  clause(lits: readonly number[]): void {
    if (this.unsat) return;
    if (lits.length === 0) {
      this.unsat = true;
      return;
    }
    if (!guarded(() => this.sat.addClause(lits as number[]))) this.unsat = true;
  }

  /**
   * Solve, optionally assuming one variable true (the assumption is retired afterwards: it is false from then on,
   * which switches off every clause it guarded). Returns the value of each variable by number, or null when UNSAT.
   */
  solve(assume?: number): (boolean | null)[] | null {
    if (this.unsat) return null;
    const ok = guarded(() => {
      this.sat.ensureVar(this.nextVar - 1);
      return assume === undefined ? this.sat.solve() : this.sat.solveAssuming(assume);
    });
    const solution = ok ? this.sat.getSolution() : null;
    if (assume !== undefined) guarded(() => this.sat.retireVar(assume));
    else if (!ok) this.unsat = true;
    return solution;
  }

  /** Switch off the clauses guarded by an activation variable that is no longer needed. */
  retire(activation: number): void {
    if (!this.unsat) guarded(() => this.sat.retireVar(activation));
  }
}

// The Emscripten build aborts by throwing a string; anything else is passed on unchanged.
function guarded<T>(call: () => T): T {
  try {
    return call();
  } catch (err) {
    if (typeof err === "string" && err.startsWith("abort("))
      throw new EngineError(
        "SOLVER_MEMORY",
        "the SAT solver ran out of its 64 MB of memory; ask for fewer solutions or a smaller network",
      );
    throw err;
  }
}

// A thin numeric-clause handle on the MiniSat build inside logic-solver 2.0.1 (Eén, Sörensson, "An extensible
// SAT-solver", SAT 2003). The formula layer of logic-solver costs tens of microseconds per clause, so clauses over
// numbered variables go straight to its MiniSat instance; the pinned version's internals are relied on here only.
import Logic from "logic-solver";

interface MiniSatInternals {
  addClause(terms: number[]): boolean;
  ensureVar(v: number): void;
  solve(): boolean;
  solveAssuming(v: number): boolean;
  getSolution(): (boolean | null)[];
  retireVar(v: number): void;
}

export class MiniSatHandle {
  private readonly sat: MiniSatInternals;
  // Numbers 1 and 2 are logic-solver's constants; ours start after them.
  private nextVar = 3;
  private unsat = false;

  constructor() {
    this.sat = (new Logic.Solver() as unknown as { _minisat: MiniSatInternals })._minisat;
  }

  newVar(): number {
    return this.nextVar++;
  }

  /** Add a clause of signed variable numbers (negative = negated). */
  clause(lits: number[]): void {
    if (!this.unsat && !this.sat.addClause(lits)) this.unsat = true;
  }

  /** Solve, optionally assuming one variable true; the assumption is retired afterwards. Returns values by variable or null. */
  solve(assume?: number): (boolean | null)[] | null {
    if (this.unsat) return null;
    this.sat.ensureVar(this.nextVar - 1);
    const ok = assume === undefined ? this.sat.solve() : this.sat.solveAssuming(assume);
    const solution = ok ? this.sat.getSolution() : null;
    if (assume !== undefined) this.sat.retireVar(assume);
    else if (!ok) this.unsat = true;
    return solution;
  }
}

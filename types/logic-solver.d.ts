// logic-solver ships no types; declare the part of its API the engine uses.
declare module "logic-solver" {
  type Term = string | number;
  type Formula = unknown;
  interface Solution {
    getMap(): Record<string, boolean>;
    getTrueVars(): string[];
    evaluate(f: Formula | Term): boolean;
  }
  class Solver {
    require(...f: (Formula | Term)[]): void;
    forbid(...f: (Formula | Term)[]): void;
    solve(): Solution | null;
    solveAssuming(f: Formula | Term): Solution | null;
  }
  const Logic: {
    Solver: typeof Solver;
    or(...f: (Formula | Term | (Formula | Term)[])[]): Formula;
    and(...f: (Formula | Term | (Formula | Term)[])[]): Formula;
    not(f: Formula | Term): Formula;
    xor(...f: (Formula | Term | (Formula | Term)[])[]): Formula;
    equiv(a: Formula | Term, b: Formula | Term): Formula;
    implies(a: Formula | Term, b: Formula | Term): Formula;
    exactlyOne(...f: (Formula | Term | (Formula | Term)[])[]): Formula;
    atMostOne(...f: (Formula | Term | (Formula | Term)[])[]): Formula;
    TRUE: Formula;
    FALSE: Formula;
    disablingAssertions<T>(f: () => T): T;
  };
  export default Logic;
}

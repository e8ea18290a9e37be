// A short in-app explanation of block emulation with a worked example small enough to check by hand.
export function BlockEmulationHelp() {
  return (
    <details
      className="rounded-lg border border-slate-200 bg-white p-4 text-sm text-slate-700"
      data-testid="block-emulation-help"
    >
      <summary className="cursor-pointer font-semibold text-slate-800">What is block emulation?</summary>
      <div className="mt-3 max-w-3xl space-y-2">
        <p>
          An elementary cellular automaton (ECA) updates every cell of a row from itself and its two neighbours; rule
          number N says the new value for neighbourhood (left, self, right) is bit 4·left + 2·self + right of N.
        </p>
        <p>
          Rule F <strong>emulates</strong> rule G with <strong>block size k</strong> when two different words u₀ and u₁
          of k cells act as "big cells": for every a, b, c in {"{0, 1}"}, running F for k steps on the 3k-cell word u_a
          u_b u_c (which loses one cell at each end per step) leaves exactly the word u_G(a,b,c). Then F, started from
          any row written in u₀ and u₁, does what G does, k of its steps per step of G.
        </p>
        <p className="font-medium text-slate-800">A worked example with k = 2: rule 18 emulates rule 90.</p>
        <p>
          Rule 18 turns a cell on exactly when its neighbourhood is 100 or 001; rule 90 sets each cell to left XOR
          right. Encode 0 as u₀ = <code className="font-mono">00</code> and 1 as u₁ ={" "}
          <code className="font-mono">10</code>. For (a, b, c) = (1, 0, 0) the word u₁u₀u₀ is{" "}
          <code className="font-mono">10 00 00</code>; one step of rule 18 gives <code className="font-mono">1000</code>
          , a second gives <code className="font-mono">10</code> = u₁, and rule 90 indeed maps 100 to 1. For (1, 0, 1):{" "}
          <code className="font-mono">10 00 10</code> → <code className="font-mono">1010</code> →{" "}
          <code className="font-mono">00</code> = u₀, and 1 XOR 1 = 0. The six other triples check out the same way
          (open rule 18 to see all eight rows).
        </p>
        <p>
          The graph draws an arrow F → G labelled with the least k that works, and leaves out every arrow another path
          already implies (F → G at k and G → H at j give F → H at k·j). Open a rule to see a witness checked cell by
          cell and both runs side by side.
        </p>
      </div>
    </details>
  );
}

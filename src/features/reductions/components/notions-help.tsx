// The three notions in plain words with one small worked example each (the same text as the README's).
export function NotionsHelp() {
  return (
    <details
      className="rounded-lg border border-slate-200 bg-white p-4 text-sm text-slate-700"
      data-testid="notions-help"
    >
      <summary className="cursor-pointer font-semibold text-slate-900">
        What do emulation, embedding and coarse-graining mean?
      </summary>
      <div className="mt-3 space-y-3">
        <p>
          <strong>Block emulation.</strong> Each node j of the smaller network G is carried by a block of F's nodes with
          two different codewords (one for “j is 0”, one for “j is 1”); every other node of F is held at a fixed context
          value. F emulates G at time scale t when running F for t steps from the encoding of any state x of G lands
          exactly on the encoding of G's next state.
        </p>
        <p className="rounded-md bg-slate-50 p-3 font-mono text-xs leading-relaxed">
          F: P' = !Q, Q' = P G: X' = !X
          <br />
          block of X = {"{P, Q}"}, codeword 0 = 00, codeword 1 = 11, t = 2<br />
          F²(00) = F(10) = 11 = e(1) = e(G(0)); F²(11) = F(01) = 00 = e(0) = e(G(1)) ✓
        </p>
        <p>
          <strong>Dynamical embedding.</strong> Any one-to-one map e from G's states into F's states with Fᵗ(e(x)) =
          e(G(x)). It exists exactly when G's state transition graph fits inside that of Fᵗ: every cycle of G onto a
          cycle of the same length, transient trees into transient trees.
        </p>
        <p>
          <strong>Coarse-graining.</strong> Observables (usually single nodes) group F's states; F coarse-grains onto G
          when the observed values after t steps depend only on the observed values now, i.e. p(Fᵗ(x)) = G(p(x)).
          Example: in F with A' = !A, B' = A, observing A alone gives G: X' = !X. When the observables do not close,
          Emulant computes the coarsest grouping that refines them and is compatible with the dynamics.
        </p>
        <p className="text-slate-500">
          A reduction is a statement about the model, not about the cell it describes. Models are research aids, not
          clinical or safety advice.
        </p>
      </div>
    </details>
  );
}

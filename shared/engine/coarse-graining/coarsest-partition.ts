// The coarsest partition of a finite map's states that refines a labelling and is compatible with the map: two states
// share a group exactly when their label sequences along the orbit agree (Moore, "Gedanken-experiments on sequential
// machines", Automata Studies, 1956). Computed by doubling: round i compares label words of length 2^i, so at most
// log2(states)+1 rounds, each linear.
import { CancelledError } from "../errors";

export interface StatePartition {
  readonly groups: number;
  /** Group of each state, numbered in order of each group's smallest state. */
  readonly groupOf: Uint32Array;
}

export function coarsestCompatiblePartition(
  succ: ArrayLike<number>,
  labels: ArrayLike<number>,
  shouldStop?: () => boolean,
): StatePartition {
  const N = succ.length;
  let { groups, groupOf } = renumber(N, (x) => labels[x]!);
  let jump = Uint32Array.from(succ);
  for (;;) {
    if (shouldStop?.()) throw new CancelledError();
    const cur = groupOf;
    const j = jump;
    const next = renumber(N, (x) => cur[x]! * groups + cur[j[x]!]!);
    if (next.groups === groups) return { groups, groupOf };
    groups = next.groups;
    groupOf = next.groupOf;
    const doubled = new Uint32Array(N);
    for (let x = 0; x < N; x++) doubled[x] = jump[jump[x]!]!;
    jump = doubled;
  }
}

function renumber(N: number, key: (x: number) => number): StatePartition {
  const ids = new Map<number, number>();
  const groupOf = new Uint32Array(N);
  for (let x = 0; x < N; x++) {
    const k = key(x);
    let id = ids.get(k);
    if (id === undefined) {
      id = ids.size;
      ids.set(k, id);
    }
    groupOf[x] = id;
  }
  return { groups: ids.size, groupOf };
}

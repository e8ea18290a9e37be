// Choose an initial state and an update scheme, then see the trajectory as a grid; under synchronous update the step
// where it enters an attractor is marked and the attractor named (from the revision's attractor list when known).
import { useState } from "react";
import type { SynchronousResult, TrajectoryBody, TrajectoryResult } from "@shared/schemas/models";
import { StateGrid, type StateGridRow } from "@/components/state-grid/state-grid";
import { attractorEntry } from "@/components/state-grid/grid-layout";
import { useTrajectory } from "../api/get-trajectory";
import { attractorName } from "./attractor-states";

type Scheme = NonNullable<TrajectoryBody["scheme"]>;

export function TrajectoryPanel({
  projectId,
  modelId,
  revision,
  nodes,
  suggestedInitial,
  attractors,
  inputs,
  fileName,
}: {
  attractors: SynchronousResult | null;
  inputs: readonly string[];
  fileName: string;
  projectId: string;
  modelId: string;
  revision: number;
  nodes: readonly string[];
  suggestedInitial: string;
}) {
  const run = useTrajectory(projectId, modelId, revision);
  const [initial, setInitial] = useState(suggestedInitial);
  const [scheme, setScheme] = useState<Scheme>("synchronous");
  const [steps, setSteps] = useState(20);
  const [seed, setSeed] = useState(1);
  const isValid = initial.length === nodes.length && /^[01]+$/.test(initial);
  const flip = (j: number) => setInitial((s) => s.slice(0, j) + (s[j] === "1" ? "0" : "1") + s.slice(j + 1));

  return (
    <div className="space-y-3">
      <form
        className="flex flex-wrap items-end gap-3 text-sm"
        onSubmit={(e) => {
          e.preventDefault();
          if (isValid) run.mutate({ initial, scheme, steps, seed });
        }}
      >
        <label className="flex flex-col gap-1">
          <span className="text-slate-700">Initial state ({nodes.length} values, model order)</span>
          <input
            data-testid="trajectory-initial"
            value={initial}
            onChange={(e) => setInitial(e.target.value.replace(/[^01]/g, "").slice(0, nodes.length))}
            className={`w-72 rounded-md border px-2 py-1 font-mono ${isValid ? "border-slate-300" : "border-red-400"}`}
          />
        </label>
        <label className="flex flex-col gap-1">
          <span className="text-slate-700">Update scheme</span>
          <select
            data-testid="trajectory-scheme"
            value={scheme}
            onChange={(e) => setScheme(e.target.value as Scheme)}
            className="rounded-md border border-slate-300 px-2 py-1"
          >
            <option value="synchronous">synchronous</option>
            <option value="random-order">random-order asynchronous</option>
            <option value="general-asynchronous">general asynchronous (one node per step)</option>
          </select>
        </label>
        <label className="flex flex-col gap-1">
          <span className="text-slate-700">Steps</span>
          <input
            type="number"
            min={1}
            max={1000}
            value={steps}
            onChange={(e) => setSteps(Number(e.target.value))}
            className="w-20 rounded-md border border-slate-300 px-2 py-1"
          />
        </label>
        {scheme !== "synchronous" && (
          <label className="flex flex-col gap-1">
            <span className="text-slate-700">Seed</span>
            <input
              type="number"
              min={0}
              value={seed}
              onChange={(e) => setSeed(Number(e.target.value))}
              className="w-20 rounded-md border border-slate-300 px-2 py-1"
            />
          </label>
        )}
        <button
          type="submit"
          disabled={!isValid || run.isPending}
          data-testid="trajectory-run"
          className="rounded-md bg-brand-700 px-3 py-1.5 font-medium text-white hover:bg-brand-800 disabled:opacity-50"
        >
          Simulate
        </button>
      </form>
      <div className="flex flex-wrap gap-1 text-xs">
        {nodes.map((n, j) => (
          <button
            key={n}
            type="button"
            onClick={() => flip(j)}
            className={`rounded px-1.5 py-0.5 font-mono ${initial[j] === "1" ? "bg-brand-600 text-white" : "bg-slate-100 text-slate-600"}`}
            title="Click to flip"
          >
            {n}
          </button>
        ))}
      </div>
      {run.error && (
        <p role="alert" className="text-sm text-red-700">
          {run.error.message}
        </p>
      )}
      {run.data && <TrajectoryGrid trajectory={run.data} attractors={attractors} inputs={inputs} fileName={fileName} />}
    </div>
  );
}

function TrajectoryGrid({
  trajectory,
  attractors,
  inputs,
  fileName,
}: {
  trajectory: TrajectoryResult;
  attractors: SynchronousResult | null;
  inputs: readonly string[];
  fileName: string;
}) {
  const synchronous = trajectory.scheme === "synchronous";
  const entry = synchronous ? attractorEntry(trajectory.states, attractors?.attractors) : null;
  const name = entry
    ? entry.attractor !== null && attractors
      ? attractorName(attractors, entry.attractor)
      : entry.length === 1
        ? "a fixed point"
        : `a cycle of ${entry.length}`
    : null;
  const rows: StateGridRow[] = trajectory.states.map((state, t) => ({
    label: `t=${t}`,
    state,
    ...(entry && t === entry.step
      ? { tone: "entry" as const, note: `enters ${name}` }
      : entry && t > entry.step
        ? { tone: "cycle" as const }
        : {}),
  }));
  return (
    <div className="space-y-2">
      <p className="text-sm text-slate-700" data-testid="trajectory-entry">
        {!synchronous
          ? "Under asynchronous update a trajectory is one of many; its entry into an attractor is not marked."
          : entry
            ? `Enters ${name} at step ${entry.step}.`
            : `Reaches no attractor within ${trajectory.states.length - 1} steps.`}
      </p>
      <StateGrid
        nodes={trajectory.nodes}
        rows={rows}
        markers={attractors?.markers ?? []}
        inputs={inputs}
        fileName={`${fileName}-trajectory`}
        caption={`Trajectory of ${trajectory.states.length - 1} steps under ${trajectory.scheme} update, one row per step.`}
        testId="trajectory-grid"
      />
    </div>
  );
}

// The search form: what to look for (a given target, anything smaller, or the closure of some observables), in
// which model, and within which bounds. Bounds are explicit because "none found" is only ever "none within these".
import { useState } from "react";
import type { SearchBody } from "@shared/schemas/reductions";
import { ApiError } from "@/lib/api-client";
import { plural } from "@/lib/plural";

export interface ModelChoice {
  id: string;
  name: string;
  nodeCount: number;
}

type Mode = SearchBody["mode"];

const modes: { mode: Mode; label: string; hint: string }[] = [
  {
    mode: "discover",
    label: "Discover",
    hint: "Enumerate encodings of 1 to 4 target nodes and report every smaller network F emulates (sources up to 20 nodes).",
  },
  {
    mode: "given-target",
    label: "Given target",
    hint: "Does F emulate (or embed) this particular model? Either a witness or a proof that none exists within the bounds.",
  },
  {
    mode: "coarse-grain",
    label: "Coarse-grain",
    hint: "Group F's states by the chosen nodes and find the smallest exact model that predicts them (sources up to 20 nodes).",
  },
];

const inputClass = "rounded-md border border-slate-300 px-2 py-1 text-sm";

function NumberField({
  label,
  value,
  min,
  max,
  onChange,
  testId,
}: {
  label: string;
  value: number;
  min: number;
  max: number;
  onChange(v: number): void;
  testId?: string;
}) {
  return (
    <label className="flex flex-col gap-1 text-sm">
      <span className="font-medium text-slate-700">{label}</span>
      <input
        type="number"
        min={min}
        max={max}
        value={value}
        data-testid={testId}
        onChange={(e) => onChange(Math.max(min, Math.min(max, Number(e.target.value) || min)))}
        className={`${inputClass} w-24`}
      />
    </label>
  );
}

export interface SearchFormProps {
  models: ModelChoice[];
  isPending: boolean;
  error: unknown;
  onSubmit(body: SearchBody): void;
}

export function SearchForm({ models, isPending, error, onSubmit }: SearchFormProps) {
  const [mode, setMode] = useState<Mode>("discover");
  // Discovery, the form's first mode, takes sources up to 20 nodes: start on a model it can search.
  const [sourceModelId, setSource] = useState((models.find((m) => m.nodeCount <= 20) ?? models[0])?.id ?? "");
  const [targetModelId, setTarget] = useState(models[1]?.id ?? models[0]?.id ?? "");
  const [notion, setNotion] = useState<"block-emulation" | "dynamical-embedding">("block-emulation");
  const [maxTargetNodes, setMaxTargetNodes] = useState(2);
  const [maxTime, setMaxTime] = useState(1);
  const [maxBlock, setMaxBlock] = useState(2);
  const [allowContext, setAllowContext] = useState(true);
  const [observe, setObserve] = useState("");
  const [time, setTime] = useState(1);

  const submit = () => {
    if (mode === "discover") onSubmit({ mode, sourceModelId, maxTargetNodes, maxTime, maxBlock, allowContext });
    else if (mode === "given-target")
      onSubmit({ mode, notion, sourceModelId, targetModelId, maxTime, maxBlock, allowContext });
    else onSubmit({ mode, sourceModelId, observe: observe.split(/[\s,]+/).filter(Boolean), time });
  };

  return (
    <form
      className="space-y-4 rounded-lg border border-slate-200 bg-white p-4"
      data-testid="search-form"
      onSubmit={(e) => {
        e.preventDefault();
        submit();
      }}
    >
      <div className="flex flex-wrap gap-2" role="tablist">
        {modes.map((m) => (
          <button
            key={m.mode}
            type="button"
            role="tab"
            aria-selected={mode === m.mode}
            onClick={() => setMode(m.mode)}
            data-testid={`mode-${m.mode}`}
            className={`rounded-md px-3 py-1.5 text-sm font-medium ${mode === m.mode ? "bg-brand-700 text-white" : "bg-slate-100 text-slate-700 hover:bg-slate-200"}`}
          >
            {m.label}
          </button>
        ))}
      </div>
      <p className="text-sm text-slate-600">{modes.find((m) => m.mode === mode)!.hint}</p>
      <div className="flex flex-wrap items-end gap-4">
        <label className="flex min-w-0 max-w-full flex-col gap-1 text-sm">
          <span className="font-medium text-slate-700">Source model F</span>
          <select
            value={sourceModelId}
            onChange={(e) => setSource(e.target.value)}
            className={`${inputClass} max-w-full`}
            data-testid="source-model"
          >
            {models.map((m) => (
              <option key={m.id} value={m.id}>
                {m.name} ({plural(m.nodeCount, "node")})
              </option>
            ))}
          </select>
        </label>
        {mode === "given-target" && (
          <>
            <label className="flex min-w-0 max-w-full flex-col gap-1 text-sm">
              <span className="font-medium text-slate-700">Target model G</span>
              <select
                value={targetModelId}
                onChange={(e) => setTarget(e.target.value)}
                className={`${inputClass} max-w-full`}
                data-testid="target-model"
              >
                {models.map((m) => (
                  <option key={m.id} value={m.id}>
                    {m.name} ({plural(m.nodeCount, "node")})
                  </option>
                ))}
              </select>
            </label>
            <label className="flex flex-col gap-1 text-sm">
              <span className="font-medium text-slate-700">Notion</span>
              <select
                value={notion}
                onChange={(e) => setNotion(e.target.value as typeof notion)}
                className={inputClass}
              >
                <option value="block-emulation">block emulation</option>
                <option value="dynamical-embedding">dynamical embedding</option>
              </select>
            </label>
          </>
        )}
        {mode === "discover" && (
          <NumberField
            label="Target nodes up to"
            value={maxTargetNodes}
            min={1}
            max={4}
            onChange={setMaxTargetNodes}
            testId="max-target-nodes"
          />
        )}
        {mode !== "coarse-grain" && (
          <NumberField
            label="Time scale t up to"
            value={maxTime}
            min={1}
            max={8}
            onChange={setMaxTime}
            testId="max-time"
          />
        )}
        {mode !== "coarse-grain" && !(mode === "given-target" && notion === "dynamical-embedding") && (
          <>
            <NumberField
              label="Block size up to"
              value={maxBlock}
              min={1}
              max={mode === "discover" ? 4 : 6}
              onChange={setMaxBlock}
              testId="max-block"
            />
            <label className="flex items-center gap-2 pb-1 text-sm">
              <input type="checkbox" checked={allowContext} onChange={(e) => setAllowContext(e.target.checked)} />
              <span>Allow context nodes</span>
            </label>
          </>
        )}
        {mode === "coarse-grain" && (
          <>
            <label className="flex flex-col gap-1 text-sm">
              <span className="font-medium text-slate-700">Observe nodes (comma-separated)</span>
              <input
                value={observe}
                onChange={(e) => setObserve(e.target.value)}
                placeholder="e.g. GlmA, GlmB"
                className={`${inputClass} w-64`}
                data-testid="observe"
              />
            </label>
            <NumberField label="Time scale t" value={time} min={1} max={8} onChange={setTime} />
          </>
        )}
      </div>
      {error != null && (
        <p role="alert" className="rounded-md bg-red-50 px-3 py-2 text-sm text-red-800">
          {error instanceof ApiError ? error.message : "The search could not be started"}
        </p>
      )}
      <button
        type="submit"
        disabled={isPending || !sourceModelId}
        className="rounded-md bg-brand-700 px-4 py-2 text-sm font-medium text-white hover:bg-brand-800 disabled:opacity-50"
        data-testid="start-search"
      >
        {isPending ? "Starting…" : "Start search"}
      </button>
    </form>
  );
}

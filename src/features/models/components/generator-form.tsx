// Create a model from a generator: a ring cellular automaton from its rule number, a Kauffman NK network from a
// seed, or a random threshold network.
import { useState } from "react";
import type { GeneratorSpec, ModelDetail } from "@shared/schemas/models";
import { useGenerateModel } from "../api/generate-model";

type Kind = GeneratorSpec["kind"];

function NumberField({
  label,
  value,
  onChange,
  min,
  max,
  step = 1,
  testId,
}: {
  label: string;
  value: number;
  onChange(v: number): void;
  min: number;
  max?: number;
  step?: number;
  testId: string;
}) {
  return (
    <label className="flex flex-col gap-1 text-sm">
      <span className="text-slate-700">{label}</span>
      <input
        type="number"
        data-testid={testId}
        value={value}
        min={min}
        max={max}
        step={step}
        onChange={(e) => onChange(Number(e.target.value))}
        className="w-32 rounded-md border border-slate-300 px-2 py-1"
      />
    </label>
  );
}

export function GeneratorForm({ projectId, onCreated }: { projectId: string; onCreated(detail: ModelDetail): void }) {
  const generate = useGenerateModel(projectId);
  const [kind, setKind] = useState<Kind>("eca");
  const [name, setName] = useState("");
  const [eca, setEca] = useState({ rule: 110, radius: 1, cells: 12 });
  const [nk, setNk] = useState({ n: 12, k: 2, p: 0.5, seed: 1 });
  const [th, setTh] = useState({ n: 12, k: 3, seed: 1, tie: "keep" as "keep" | "zero" });

  const spec: GeneratorSpec = kind === "eca" ? { kind, ...eca } : kind === "nk" ? { kind, ...nk } : { kind, ...th };
  const defaultName =
    kind === "eca"
      ? `Rule ${eca.rule} ring of ${eca.cells}`
      : kind === "nk"
        ? `NK N=${nk.n} K=${nk.k} seed ${nk.seed}`
        : `Threshold N=${th.n} K=${th.k} seed ${th.seed}`;

  return (
    <form
      className="space-y-4"
      onSubmit={(e) => {
        e.preventDefault();
        generate.mutate({ name: name.trim() || defaultName, generator: spec }, { onSuccess: onCreated });
      }}
    >
      <fieldset className="flex flex-wrap gap-4 text-sm">
        <legend className="mb-1 font-medium text-slate-800">Generator</legend>
        {(
          [
            ["eca", "Cellular automaton ring"],
            ["nk", "NK random network"],
            ["threshold", "Threshold network"],
          ] as const
        ).map(([k, label]) => (
          <label key={k} className="flex items-center gap-2">
            <input type="radio" name="generator-kind" checked={kind === k} onChange={() => setKind(k)} />
            {label}
          </label>
        ))}
      </fieldset>
      <div className="flex flex-wrap gap-4">
        {kind === "eca" && (
          <>
            <NumberField
              label="Rule number"
              testId="gen-rule"
              value={eca.rule}
              min={0}
              onChange={(rule) => setEca({ ...eca, rule })}
            />
            <NumberField
              label="Radius"
              testId="gen-radius"
              value={eca.radius}
              min={1}
              max={2}
              onChange={(radius) => setEca({ ...eca, radius })}
            />
            <NumberField
              label="Cells"
              testId="gen-cells"
              value={eca.cells}
              min={3}
              max={200}
              onChange={(cells) => setEca({ ...eca, cells })}
            />
          </>
        )}
        {kind === "nk" && (
          <>
            <NumberField
              label="Nodes N"
              testId="gen-n"
              value={nk.n}
              min={1}
              max={200}
              onChange={(n) => setNk({ ...nk, n })}
            />
            <NumberField
              label="Regulators K"
              testId="gen-k"
              value={nk.k}
              min={0}
              max={10}
              onChange={(k) => setNk({ ...nk, k })}
            />
            <NumberField
              label="Bias p"
              testId="gen-p"
              value={nk.p}
              min={0}
              max={1}
              step={0.05}
              onChange={(p) => setNk({ ...nk, p })}
            />
            <NumberField
              label="Seed"
              testId="gen-seed"
              value={nk.seed}
              min={0}
              onChange={(seed) => setNk({ ...nk, seed })}
            />
          </>
        )}
        {kind === "threshold" && (
          <>
            <NumberField
              label="Nodes N"
              testId="gen-n"
              value={th.n}
              min={1}
              max={200}
              onChange={(n) => setTh({ ...th, n })}
            />
            <NumberField
              label="Regulators K"
              testId="gen-k"
              value={th.k}
              min={1}
              max={10}
              onChange={(k) => setTh({ ...th, k })}
            />
            <NumberField
              label="Seed"
              testId="gen-seed"
              value={th.seed}
              min={0}
              onChange={(seed) => setTh({ ...th, seed })}
            />
            <label className="flex flex-col gap-1 text-sm">
              <span className="text-slate-700">On a tie</span>
              <select
                value={th.tie}
                onChange={(e) => setTh({ ...th, tie: e.target.value as "keep" | "zero" })}
                className="rounded-md border border-slate-300 px-2 py-1"
              >
                <option value="keep">keep the value</option>
                <option value="zero">decay to 0</option>
              </select>
            </label>
          </>
        )}
      </div>
      <label className="flex max-w-md flex-col gap-1 text-sm">
        <span className="text-slate-700">Name</span>
        <input
          value={name}
          placeholder={defaultName}
          onChange={(e) => setName(e.target.value)}
          className="rounded-md border border-slate-300 px-2 py-1"
        />
      </label>
      {generate.error && (
        <p role="alert" className="text-sm text-red-700">
          {generate.error.message}
        </p>
      )}
      <button
        type="submit"
        disabled={generate.isPending}
        className="rounded-md bg-brand-700 px-4 py-2 text-sm font-medium text-white hover:bg-brand-800 disabled:opacity-50"
      >
        {generate.isPending ? "Generating…" : "Generate model"}
      </button>
    </form>
  );
}

// Starting a run by hand: attractors of rule text (the form opens on it), the elementary-rule hierarchy, or the
// demonstration counter (to see sharding and progress).
// Analyses of a model revision are started from the model's page through the same endpoint.
import { useState, type FormEvent } from "react";
import { MAX_HIERARCHY_BLOCK } from "@shared/schemas/automata";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { useStartRun } from "../api/start-run";

const inputClass = "w-full rounded-md border border-slate-300 px-2 py-1.5 text-sm";

export function StartRunForm({
  projectId,
  onStarted,
}: {
  projectId: string;
  onStarted(runId: string, reused: boolean): void;
}) {
  const start = useStartRun();
  const [kind, setKind] = useState<"sleep-count" | "eca-hierarchy" | "attractors">("attractors");
  const [maxBlock, setMaxBlock] = useState(12);
  const [itemCount, setItemCount] = useState(2000);
  const [shardCount, setShardCount] = useState(4);
  const [delayMsPerItem, setDelay] = useState(5);
  const [ruleText, setRuleText] = useState("a' = !b\nb' = !a");

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const body =
      kind === "sleep-count"
        ? { kind, params: { itemCount, shardCount, delayMsPerItem } }
        : kind === "eca-hierarchy"
          ? { kind, params: { maxBlock, timeMode: "block" as const, radius: 1 as const } }
          : { kind, params: { ruleText } };
    start.mutate({ projectId, body }, { onSuccess: (run) => onStarted(run.id, run.reused) });
  };

  return (
    <form
      onSubmit={submit}
      className="space-y-3 rounded-lg border border-slate-200 bg-white p-4"
      data-testid="start-run-form"
    >
      <div className="flex flex-wrap items-end gap-3">
        <label className="text-sm">
          <span className="mb-1 block text-slate-600">Kind</span>
          <select
            className={inputClass}
            value={kind}
            onChange={(e) => setKind(e.target.value as typeof kind)}
            data-testid="start-kind"
          >
            <option value="attractors">Attractors of rule text</option>
            <option value="eca-hierarchy">Elementary-rule hierarchy</option>
            <option value="sleep-count">Demonstration count (shows sharding and progress)</option>
          </select>
        </label>
        {kind === "sleep-count" ? (
          <>
            <label className="text-sm">
              <span className="mb-1 block text-slate-600">Items</span>
              <input
                type="number"
                min={1}
                className={inputClass}
                value={itemCount}
                onChange={(e) => setItemCount(Number(e.target.value))}
                data-testid="start-items"
              />
            </label>
            <label className="text-sm">
              <span className="mb-1 block text-slate-600">Shards</span>
              <input
                type="number"
                min={1}
                max={64}
                className={inputClass}
                value={shardCount}
                onChange={(e) => setShardCount(Number(e.target.value))}
                data-testid="start-shards"
              />
            </label>
            <label className="text-sm">
              <span className="mb-1 block text-slate-600">Delay per item (ms)</span>
              <input
                type="number"
                min={0}
                max={1000}
                className={inputClass}
                value={delayMsPerItem}
                onChange={(e) => setDelay(Number(e.target.value))}
                data-testid="start-delay"
              />
            </label>
          </>
        ) : kind === "eca-hierarchy" ? (
          <label className="text-sm">
            <span className="mb-1 block text-slate-600">Largest block size</span>
            <input
              type="number"
              min={1}
              max={MAX_HIERARCHY_BLOCK}
              className={inputClass}
              value={maxBlock}
              onChange={(e) => setMaxBlock(Number(e.target.value))}
              data-testid="start-max-block"
            />
          </label>
        ) : (
          <label className="min-w-64 flex-1 text-sm">
            <span className="mb-1 block text-slate-600">Rule text</span>
            <textarea
              rows={3}
              className={`${inputClass} font-mono`}
              value={ruleText}
              onChange={(e) => setRuleText(e.target.value)}
              data-testid="start-rule-text"
            />
          </label>
        )}
        <Button type="submit" disabled={start.isPending} data-testid="start-run">
          Start run
        </Button>
      </div>
      {start.error && <Alert>{start.error.message}</Alert>}
    </form>
  );
}

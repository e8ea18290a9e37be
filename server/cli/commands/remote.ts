// `remote <command> --server URL`: the same work as the web app, from a script, with a personal access token in
// EMULANT_TOKEN. Answers are printed as JSON on stdout; waiting shows a progress bar on stderr. Exit codes as for
// the local commands: 0 done, 1 refused or failed (an API error, a failed or cancelled run), 2 usage.
import { openAsBlob } from "node:fs";
import { stat, writeFile } from "node:fs/promises";
import { basename } from "node:path";
import { z } from "zod";
import { ModelDetail } from "@shared/schemas/models";
import { ReductionListQuery } from "@shared/schemas/reductions";
import { isRunFinished, Run, StartRunResponse } from "@shared/schemas/runs";
import { CommandError, integerOption, parseCommandArgs, printJson, runCommand, UsageError } from "../cli-io";
import { remoteFrom, remoteJson, remoteText, type Remote } from "../remote-client";

export const summary =
  "remote <push|runs|reductions> … --server URL: work on an Emulant server with EMULANT_TOKEN (see README, Scripting)";
const USAGE = `usage: remote <command> --server URL --project ID   (token in EMULANT_TOKEN)
  push <file> [--name NAME]                          import a model file (.rules, .sbml, .xml, .csv)
  runs start --kind attractors --model ID            analyse a model's latest revision
  runs start --kind discover --model ID [--max-target-nodes N] [--max-time N] [--max-block N]
  runs start --kind coarse-grain --model ID --observe A,B [--time N]
  runs start --kind given-target --model ID --target ID [--notion block-emulation|dynamical-embedding]
  runs wait <runId> [--interval-ms N]                 progress bar on stderr; exit 1 unless the run succeeded
  runs show <runId>
  reductions list [--source-model ID] [--state proposed|approved|rejected]
  reductions certificate <reductionId> [--out FILE]`;

const options = {
  server: { type: "string" },
  project: { type: "string" },
  name: { type: "string" },
  kind: { type: "string" },
  model: { type: "string" },
  target: { type: "string" },
  notion: { type: "string" },
  observe: { type: "string" },
  time: { type: "string" },
  "max-target-nodes": { type: "string" },
  "max-time": { type: "string" },
  "max-block": { type: "string" },
  "interval-ms": { type: "string" },
  "source-model": { type: "string" },
  state: { type: "string" },
  out: { type: "string" },
} as const;
type Values = Partial<Record<keyof typeof options, string>>;

function projectOf(values: Values): string {
  const id = values.project;
  if (!id) throw new UsageError("--project ID is required");
  if (!z.uuid().safeParse(id).success) throw new UsageError(`--project must be a project id (a UUID), got "${id}"`);
  return id;
}

const one = (positionals: string[], what: string): string => {
  if (positionals.length !== 1) throw new UsageError(`give exactly one ${what}`);
  return positionals[0]!;
};

async function push(remote: Remote, values: Values, positionals: string[]): Promise<number> {
  const file = one(positionals, "model file");
  const projectId = projectOf(values);
  const size = await stat(file).catch(() => {
    throw new CommandError(`cannot read ${file}`);
  });
  if (!size.isFile()) throw new CommandError(`${file} is not a file`);
  const form = new FormData();
  form.append("file", await openAsBlob(file), basename(file));
  if (values.name) form.append("name", values.name);
  printJson(
    await remoteJson(remote, `/projects/${projectId}/models/upload`, ModelDetail, {
      method: "POST",
      body: form,
    }),
  );
  return 0;
}

async function startRun(remote: Remote, values: Values): Promise<number> {
  const projectId = projectOf(values);
  const model = values.model;
  if (!model) throw new UsageError("--model ID is required");
  const kind = values.kind;
  const base = `/projects/${projectId}`;
  let run: StartRunResponse;
  if (kind === "attractors") {
    const detail = await remoteJson(remote, `${base}/models/${model}`, ModelDetail);
    run = await remoteJson(remote, `${base}/runs`, StartRunResponse, {
      method: "POST",
      json: { kind: "attractors", modelRevisionId: detail.revision.id, params: {} },
    });
  } else {
    const search =
      kind === "discover"
        ? {
            mode: "discover",
            sourceModelId: model,
            maxTargetNodes: integerOption(values["max-target-nodes"], "--max-target-nodes", 1, 4, 2),
            maxTime: integerOption(values["max-time"], "--max-time", 1, 8, 1),
            maxBlock: integerOption(values["max-block"], "--max-block", 1, 4, 2),
          }
        : kind === "coarse-grain"
          ? {
              mode: "coarse-grain",
              sourceModelId: model,
              observe: (values.observe ?? "").split(",").filter(Boolean),
              time: integerOption(values.time, "--time", 1, 8, 1),
            }
          : kind === "given-target"
            ? {
                mode: "given-target",
                sourceModelId: model,
                targetModelId: values.target,
                notion: values.notion ?? "block-emulation",
              }
            : null;
    if (!search) throw new UsageError("--kind is attractors, discover, coarse-grain or given-target");
    run = await remoteJson(remote, `${base}/reductions/searches`, StartRunResponse, { method: "POST", json: search });
  }
  printJson(run);
  return 0;
}

function progressBar(run: Run): string {
  const width = 30;
  const filled = Math.round(run.progressFraction * width);
  const percent = `${Math.floor(run.progressFraction * 100)}`.padStart(3);
  return `[${"#".repeat(filled)}${"-".repeat(width - filled)}] ${percent}% ${run.state} ${run.progressPhase}`;
}

async function waitRun(remote: Remote, values: Values, positionals: string[]): Promise<number> {
  const path = `/projects/${projectOf(values)}/runs/${one(positionals, "run id")}`;
  const interval = integerOption(values["interval-ms"], "--interval-ms", 50, 60_000, 1000);
  const tty = process.stderr.isTTY;
  for (;;) {
    const run = await remoteJson(remote, path, Run);
    // On a terminal the bar redraws in place; in a log every change is its own line.
    process.stderr.write(tty ? `\r${progressBar(run)}\x1b[K` : `${progressBar(run)}\n`);
    if (isRunFinished(run.state)) {
      if (tty) process.stderr.write("\n");
      printJson(run);
      if (run.state !== "succeeded")
        process.stderr.write(`run ${run.state}${run.error ? `: ${run.error.code}: ${run.error.message}` : ""}\n`);
      return run.state === "succeeded" ? 0 : 1;
    }
    await new Promise((r) => setTimeout(r, interval));
  }
}

async function reductions(remote: Remote, sub: string | undefined, values: Values, positionals: string[]) {
  const base = `/projects/${projectOf(values)}/reductions`;
  if (sub === "list") {
    const query = ReductionListQuery.safeParse({ sourceModelId: values["source-model"], state: values.state });
    if (!query.success)
      throw new UsageError(`--${query.error.issues[0]!.path.join(".")}: ${query.error.issues[0]!.message}`);
    const qs = new URLSearchParams(Object.entries(query.data).filter((e): e is [string, string] => !!e[1]));
    printJson(await remoteJson(remote, `${base}${qs.size ? `?${qs}` : ""}`, z.array(z.unknown())));
    return 0;
  }
  if (sub === "certificate") {
    const text = await remoteText(remote, `${base}/${one(positionals, "reduction id")}/certificate`);
    if (values.out) await writeFile(values.out, text);
    else process.stdout.write(text.endsWith("\n") ? text : `${text}\n`);
    return 0;
  }
  throw new UsageError("reductions takes list or certificate");
}

export function run(args: string[]): Promise<number> {
  return runCommand("remote", USAGE, async () => {
    const { values, positionals } = parseCommandArgs(args, options);
    const [command, ...rest] = positionals;
    const remote = remoteFrom(values.server);
    if (command === "push") return push(remote, values, rest);
    if (command === "runs") {
      const [sub, ...ids] = rest;
      if (sub === "start") {
        if (ids.length) throw new UsageError(`unexpected argument "${ids[0]}"`);
        return startRun(remote, values);
      }
      if (sub === "wait") return waitRun(remote, values, ids);
      if (sub === "show") {
        printJson(await remoteJson(remote, `/projects/${projectOf(values)}/runs/${one(ids, "run id")}`, Run));
        return 0;
      }
      throw new UsageError("runs takes start, wait or show");
    }
    if (command === "reductions") return reductions(remote, rest[0], values, rest.slice(1));
    throw new UsageError(command ? `unknown remote command "${command}"` : "name a remote command");
  });
}

// Tells a run's starter that a long run ended: an in-app notification, and an e-mail through the same mail path
// as invitations. Short runs notify nobody (the person is still looking at the page).
import type { Knex } from "knex";
import type { Logger } from "pino";
import type { Run } from "@shared/schemas/runs";
import { insertNotification } from "../db/repositories/notifications";
import { findUserById } from "../db/repositories/users";
import type { Mailer } from "../mail/mailer";

export interface NotifyDeps {
  db: Knex;
  log: Logger;
  mailer: Mailer | null;
  publicUrl: string;
  notifyAfterSeconds: number;
}

export async function notifyRunFinished(deps: NotifyDeps, run: Run): Promise<void> {
  if (!run.startedBy || !run.startedAt || !run.finishedAt) return;
  if (run.state !== "succeeded" && run.state !== "failed") return;
  const seconds = (Date.parse(run.finishedAt) - Date.parse(run.startedAt)) / 1000;
  if (seconds <= deps.notifyAfterSeconds) return;
  const link = `/projects/${run.projectId}/runs/${run.id}`;
  const verb = run.state === "succeeded" ? "finished" : "failed";
  const title = `Your ${run.kind} run ${verb}`;
  const body =
    run.state === "succeeded"
      ? `The ${run.kind} run you started finished after ${formatSeconds(seconds)}.`
      : `The ${run.kind} run you started failed after ${formatSeconds(seconds)}: ${run.error?.message ?? "unknown error"}.`;
  await insertNotification(deps.db, {
    userId: run.startedBy,
    kind: `run.${run.state}`,
    title,
    body,
    link,
    runId: run.id,
  });
  const user = await findUserById(deps.db, run.startedBy);
  if (!user || !deps.mailer) return;
  try {
    await deps.mailer.send({
      to: user.email,
      subject: `Emulant: ${title}`,
      text: `Hello ${user.displayName},\n\n${body}\n\nOpen it: ${deps.publicUrl}${link}\n`,
    });
  } catch (err) {
    // The in-app notification is stored; a mail failure must not fail the run.
    deps.log.warn({ err: { message: (err as Error).message }, runId: run.id }, "run notification e-mail failed");
  }
}

function formatSeconds(s: number): string {
  if (s < 120) return `${Math.round(s)} s`;
  if (s < 7200) return `${Math.round(s / 60)} min`;
  return `${(s / 3600).toFixed(1)} h`;
}

// A model's table of expectations: list, add, edit, remove one, import a CSV table (all or nothing: any error
// with its line and column refuses the whole file) and export it in the documented format (docs/expectations-csv.md).
// Every change is audited and followed by a background check of the model's latest revision.
import type { Knex } from "knex";
import { parseExpectationsCsv, writeExpectationsCsv, type Expectation } from "@shared/engine/expectations";
import type { ExpectationInput, ImportExpectationsResult, StoredExpectation } from "@shared/schemas/expectations";
import { recordAudit } from "../../db/repositories/audit-log";
import {
  deleteExpectation,
  deleteExpectationsExcept,
  findExpectation,
  insertExpectation,
  listExpectations,
  updateExpectation,
} from "../../db/repositories/expectations";
import { HttpError } from "../../http/errors";
import { paramsHash, type LifecycleDeps } from "../../jobs/run-lifecycle";
import { checkInBackground } from "./expectation-check";

export interface TableActor {
  projectId: string;
  modelId: string;
  userId: string;
}

/** The hash of what is checked (not the id, source or note, which do not change a result). */
export function bodyHash(e: Expectation): string {
  return paramsHash({ update: e.update, condition: e.condition, outcome: e.outcome });
}

async function latestRevisionId(db: Knex, actor: TableActor): Promise<string> {
  const row = (await db("models as m")
    .join("model_revisions as r", function () {
      this.on("r.model_id", "=", "m.id").andOn("r.revision", "=", "m.latest_revision");
    })
    .where({ "m.id": actor.modelId, "m.project_id": actor.projectId })
    .first("r.id")) as { id: string } | undefined;
  if (!row) throw new HttpError(404, "NOT_FOUND", "No such model in this project");
  return row.id;
}

async function recheck(runs: LifecycleDeps, actor: TableActor) {
  const revisionId = await latestRevisionId(runs.db, actor);
  return checkInBackground(runs, null, { ...actor, revisionId, startedBy: actor.userId });
}

export async function modelExpectations(db: Knex, actor: Omit<TableActor, "userId">): Promise<StoredExpectation[]> {
  await latestRevisionId(db, { ...actor, userId: "" });
  return listExpectations(db, actor.modelId);
}

function conflict(err: unknown, key: string): never {
  if ((err as { code?: string }).code === "23505")
    throw new HttpError(409, "CONFLICT", `This model already has an expectation with id ${key}`, [
      { field: "body.id", message: "already used in this model" },
    ]);
  throw err;
}

export async function addExpectation(
  runs: LifecycleDeps,
  actor: TableActor,
  input: ExpectationInput & Expectation,
): Promise<StoredExpectation> {
  await latestRevisionId(runs.db, actor);
  const id = await runs.db
    .transaction(async (trx) => {
      const rowId = await insertExpectation(trx, actor.modelId, actor.userId, {
        expectation: input,
        bodyHash: bodyHash(input),
      });
      await audit(trx, actor, "expectation.create", { key: input.id });
      return rowId;
    })
    .catch((err: unknown) => conflict(err, input.id));
  await recheck(runs, actor);
  return (await findExpectation(runs.db, actor.modelId, id))!;
}

export async function editExpectation(
  runs: LifecycleDeps,
  actor: TableActor,
  rowId: string,
  input: Expectation,
): Promise<StoredExpectation> {
  await latestRevisionId(runs.db, actor);
  const found = await runs.db
    .transaction(async (trx) => {
      const ok = await updateExpectation(trx, actor.modelId, rowId, { expectation: input, bodyHash: bodyHash(input) });
      if (ok) await audit(trx, actor, "expectation.update", { key: input.id });
      return ok;
    })
    .catch((err: unknown) => conflict(err, input.id));
  if (!found) throw new HttpError(404, "NOT_FOUND", "No such expectation on this model");
  await recheck(runs, actor);
  return (await findExpectation(runs.db, actor.modelId, rowId))!;
}

export async function removeExpectation(db: Knex, actor: TableActor, rowId: string): Promise<void> {
  await latestRevisionId(db, actor);
  const stored = await findExpectation(db, actor.modelId, rowId);
  if (!stored) throw new HttpError(404, "NOT_FOUND", "No such expectation on this model");
  await db.transaction(async (trx) => {
    await deleteExpectation(trx, actor.modelId, rowId);
    await audit(trx, actor, "expectation.delete", { key: stored.expectation.id });
  });
}

export async function importExpectations(
  runs: LifecycleDeps,
  actor: TableActor,
  csv: string,
  mode: "add" | "replace",
): Promise<ImportExpectationsResult> {
  await latestRevisionId(runs.db, actor);
  const table = parseExpectationsCsv(csv);
  if (table.errors.length > 0) {
    const first = table.errors[0]!;
    const more = table.errors.length - 1;
    throw new HttpError(
      400,
      "PARSE_ERROR",
      `The expectations table could not be read: ${first.reason} (line ${first.line}, column ${first.column})` +
        (more > 0 ? ` and ${more}${table.truncated ? "+" : ""} more problem${more === 1 ? "" : "s"}` : "") +
        "; nothing was imported",
      table.errors.map((e) => ({ line: e.line, column: e.column, message: e.reason })),
    );
  }
  const counts = await runs.db.transaction(async (trx) => {
    const existing = new Map((await listExpectations(trx, actor.modelId)).map((s) => [s.expectation.id, s.id]));
    let added = 0;
    let replaced = 0;
    for (const e of table.expectations) {
      const write = { expectation: e, bodyHash: bodyHash(e) };
      const rowId = existing.get(e.id);
      if (rowId) {
        await updateExpectation(trx, actor.modelId, rowId, write);
        replaced++;
      } else {
        await insertExpectation(trx, actor.modelId, actor.userId, write);
        added++;
      }
    }
    const removed =
      mode === "replace"
        ? await deleteExpectationsExcept(
            trx,
            actor.modelId,
            table.expectations.map((e) => e.id),
          )
        : 0;
    await audit(trx, actor, "expectation.import", { mode, added, replaced, removed });
    return { added, replaced, removed };
  });
  const check = await recheck(runs, actor);
  return { ...counts, checkRunId: check?.runId ?? null };
}

export async function exportExpectations(db: Knex, actor: Omit<TableActor, "userId">): Promise<string> {
  const stored = await modelExpectations(db, actor);
  return writeExpectationsCsv(stored.map((s) => s.expectation as Expectation));
}

function audit(trx: Knex, actor: TableActor, action: string, details: Record<string, unknown>) {
  return recordAudit(trx, {
    projectId: actor.projectId,
    actorId: actor.userId,
    action,
    target: actor.modelId,
    details,
  });
}

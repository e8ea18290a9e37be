// The whole role matrix: every API route, called by each kind of caller, answers exactly the status in the table.
// Each cell runs against its own freshly made project (seed-independent fixtures), so a successful delete in one
// cell cannot change what the next cell sees. Personal access tokens call every route too: a token answers as its
// owner would, except where its scope or the route refuses tokens (see tokenExpected).
import { randomUUID } from "node:crypto";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { newInvitationToken } from "../../server/db/repositories/invitations";
import { hashPassword } from "../../server/http/password-hash";
import { insertAccessToken, newAccessTokenSecret } from "../../server/db/repositories/access-tokens";
import { routeRegistry } from "../../server/http/route-registry";
import { sessionCookieFor } from "../support/sessions";
import { insertReduction } from "../../server/db/repositories/reductions";
import { statementKey } from "../../server/services/reductions/statement-key";
import { blockEmulationCertificate, eliminationCertificate } from "@shared/engine/certificates";
import { eliminateNodes } from "@shared/engine/elimination";
import { printRuleText, networkToDefinition } from "@shared/engine/rules";
import type { NodeEliminationResult } from "@shared/schemas/run-tasks";
import { compileDefinition, readRuleText } from "@shared/engine/rules";
import type { Certificate } from "@shared/schemas/reductions";
import { buildTestApp, testConfig } from "../support/test-app";

const callers = ["anonymous", "nonMember", "viewer", "reviewer", "modeler", "owner", "admin"] as const;
type Caller = (typeof callers)[number];
type Person = Exclude<Caller, "anonymous">;
/** Token callers: whose token, and its scope. */
const tokenCallers = [
  ["viewer", "read"],
  ["modeler", "read"],
  ["viewer", "write"],
  ["reviewer", "write"],
  ["modeler", "write"],
  ["owner", "write"],
  ["admin", "write"],
] as const satisfies readonly (readonly [Person, "read" | "write"])[];
type Statuses = [
  anonymous: number,
  nonMember: number,
  viewer: number,
  reviewer: number,
  modeler: number,
  owner: number,
  admin: number,
];

/** What a route may refer to; each cell gets fresh values. */
interface Fixture {
  projectId: string;
  projectName: string;
  /** A viewer who is not one of the callers, for role changes and removal. */
  targetUserId: string;
  /** A pending invitation, for revoking. */
  invitationId: string;
  /** Token of a pending invitation to an address without an account, for preview and accept. */
  token: string;
  freshEmail: string;
  /** A queued run (read, cancel, delete) and a failed one (retry). */
  runId: string;
  failedRunId: string;
  /** A succeeded node-elimination run of the model (A eliminated), whose reduced model can be saved. */
  eliminationRunId: string;
  /** A two-node model with one revision that was uploaded from a file. */
  modelId: string;
  /** An expectation of that model. */
  expectationId: string;
  /** A proposed reduction of that model onto a one-node oscillator, with the certificate that proves it. */
  reductionId: string;
  certificate: object;
  /** A token id nobody has. */
  unknownTokenId: string;
}

/** One route; `path` may name any Fixture field in braces ({projectId}), which each cell fills from its own fixture. */
interface Row {
  method: "get" | "post" | "patch" | "delete";
  path: string;
  body?: (f: Fixture) => object;
  expected: Statuses;
  /** The route ends the caller's session, so each cell signs in with a session of its own. */
  ownSession?: true;
  /**
   * Which tokens may call the route: "read" for every token (the default for GET), "write" for write tokens only
   * (the default for other methods), "none" when the route takes a browser session only.
   */
  tokens?: "read" | "write" | "none";
}

const PASSWORD = "matrix-password-1";

// anonymous, non-member, viewer, reviewer, modeler, owner, admin
const rows: Row[] = [
  { method: "get", path: "/api/health", expected: [200, 200, 200, 200, 200, 200, 200] },
  { method: "get", path: "/api/openapi.json", expected: [200, 200, 200, 200, 200, 200, 200] },
  { method: "get", path: "/api/auth/session", expected: [200, 200, 200, 200, 200, 200, 200] },
  {
    method: "post",
    path: "/api/auth/sign-up",
    body: (f) => ({ email: f.freshEmail, displayName: "New person", password: PASSWORD }),
    expected: [202, 202, 202, 202, 202, 202, 202],
  },
  {
    method: "post",
    path: "/api/auth/sign-up/confirm",
    body: () => ({ token: "no-such-sign-up-link-token-at-all" }),
    expected: [404, 404, 404, 404, 404, 404, 404],
  },
  {
    method: "post",
    path: "/api/auth/sign-in",
    body: () => ({ email: emailOf.viewer, password: PASSWORD }),
    expected: [200, 200, 200, 200, 200, 200, 200],
  },
  { method: "post", path: "/api/auth/sign-out", expected: [204, 204, 204, 204, 204, 204, 204], ownSession: true },
  { method: "get", path: "/api/users/me", expected: [401, 200, 200, 200, 200, 200, 200] },
  {
    method: "patch",
    path: "/api/users/me",
    body: () => ({ displayName: "Renamed in the matrix" }),
    expected: [401, 200, 200, 200, 200, 200, 200],
  },
  {
    method: "post",
    path: "/api/users/me/password",
    body: () => ({ currentPassword: "not-the-password", newPassword: "another-password-2" }),
    expected: [401, 400, 400, 400, 400, 400, 400],
    tokens: "none",
  },
  { method: "get", path: "/api/users/me/tokens", expected: [401, 200, 200, 200, 200, 200, 200], tokens: "none" },
  {
    method: "post",
    path: "/api/users/me/tokens",
    body: () => ({ name: "Matrix token", scope: "read", expiresInDays: 7 }),
    expected: [401, 201, 201, 201, 201, 201, 201],
    tokens: "none",
  },
  {
    method: "delete",
    path: "/api/users/me/tokens/{unknownTokenId}",
    expected: [401, 404, 404, 404, 404, 404, 404],
    tokens: "none",
  },
  { method: "get", path: "/api/mailbox", expected: [401, 403, 403, 403, 403, 403, 200], tokens: "none" },
  { method: "get", path: "/api/projects", expected: [401, 200, 200, 200, 200, 200, 200] },
  {
    method: "post",
    path: "/api/projects",
    body: () => ({ name: "Matrix scratch project" }),
    expected: [401, 201, 201, 201, 201, 201, 201],
  },
  { method: "get", path: "/api/projects/{projectId}", expected: [401, 404, 200, 200, 200, 200, 200] },
  {
    method: "patch",
    path: "/api/projects/{projectId}",
    body: () => ({ name: "Renamed project" }),
    expected: [401, 404, 403, 403, 403, 200, 200],
  },
  {
    method: "delete",
    path: "/api/projects/{projectId}",
    body: (f) => ({ confirmName: f.projectName }),
    expected: [401, 404, 403, 403, 403, 204, 204],
  },
  { method: "get", path: "/api/projects/{projectId}/members", expected: [401, 404, 200, 200, 200, 200, 200] },
  {
    method: "patch",
    path: "/api/projects/{projectId}/members/{targetUserId}",
    body: () => ({ role: "modeler" }),
    expected: [401, 404, 403, 403, 403, 200, 200],
  },
  {
    method: "delete",
    path: "/api/projects/{projectId}/members/{targetUserId}",
    expected: [401, 404, 403, 403, 403, 204, 204],
  },
  { method: "get", path: "/api/projects/{projectId}/invitations", expected: [401, 404, 403, 403, 403, 200, 200] },
  {
    method: "post",
    path: "/api/projects/{projectId}/invitations",
    body: (f) => ({ email: f.freshEmail, role: "viewer" }),
    expected: [401, 404, 403, 403, 403, 201, 201],
  },
  {
    method: "delete",
    path: "/api/projects/{projectId}/invitations/{invitationId}",
    expected: [401, 404, 403, 403, 403, 204, 204],
  },
  { method: "get", path: "/api/projects/{projectId}/audit", expected: [401, 404, 200, 200, 200, 200, 200] },
  { method: "get", path: "/api/invitations/{token}", expected: [200, 200, 200, 200, 200, 200, 200] },
  // The invitation is for an address without an account: only an anonymous visitor can create that account.
  {
    method: "post",
    path: "/api/invitations/{token}/accept",
    body: () => ({ displayName: "Invited person", password: PASSWORD }),
    expected: [200, 403, 403, 403, 403, 403, 403],
  },
  { method: "get", path: "/api/projects/{projectId}/runs", expected: [401, 404, 200, 200, 200, 200, 200] },
  {
    method: "post",
    path: "/api/projects/{projectId}/runs",
    body: () => ({ kind: "sleep-count", params: { itemCount: 10, shardCount: 1 } }),
    expected: [401, 404, 403, 403, 201, 201, 201],
  },
  { method: "get", path: "/api/projects/{projectId}/runs/{runId}", expected: [401, 404, 200, 200, 200, 200, 200] },
  {
    method: "post",
    path: "/api/projects/{projectId}/runs/{runId}/cancel",
    expected: [401, 404, 403, 403, 200, 200, 200],
  },
  {
    method: "post",
    path: "/api/projects/{projectId}/runs/{failedRunId}/retry",
    expected: [401, 404, 403, 403, 200, 200, 200],
  },
  { method: "delete", path: "/api/projects/{projectId}/runs/{runId}", expected: [401, 404, 403, 403, 204, 204, 204] },
  { method: "get", path: "/api/projects/{projectId}/models", expected: [401, 404, 200, 200, 200, 200, 200] },
  {
    method: "post",
    path: "/api/projects/{projectId}/models",
    body: () => ({ name: "Matrix model", ruleText: "A' = !B\nB' = !A\n" }),
    expected: [401, 404, 403, 403, 201, 201, 201],
  },
  {
    method: "post",
    path: "/api/projects/{projectId}/models/validate",
    body: () => ({ ruleText: "A' = !A\n" }),
    expected: [401, 404, 200, 200, 200, 200, 200],
    tokens: "read",
  },
  // A JSON body carries no file: callers allowed to write get 400, the others are stopped before reading it.
  {
    method: "post",
    path: "/api/projects/{projectId}/models/upload",
    body: () => ({ name: "No file" }),
    expected: [401, 404, 403, 403, 400, 400, 400],
  },
  {
    method: "post",
    path: "/api/projects/{projectId}/models/upload/preview",
    body: () => ({ name: "No file" }),
    expected: [401, 404, 403, 403, 400, 400, 400],
  },
  {
    method: "post",
    path: "/api/projects/{projectId}/models/generate",
    body: () => ({ name: "Matrix ring", generator: { kind: "eca", rule: 30, radius: 1, cells: 6 } }),
    expected: [401, 404, 403, 403, 201, 201, 201],
  },
  { method: "get", path: "/api/projects/{projectId}/models/{modelId}", expected: [401, 404, 200, 200, 200, 200, 200] },
  {
    method: "get",
    path: "/api/projects/{projectId}/models/{modelId}/revisions",
    expected: [401, 404, 200, 200, 200, 200, 200],
  },
  {
    method: "post",
    path: "/api/projects/{projectId}/models/{modelId}/revisions",
    body: () => ({ ruleText: "A' = B\nB' = A\n" }),
    expected: [401, 404, 403, 403, 201, 201, 201],
  },
  {
    method: "get",
    path: "/api/projects/{projectId}/models/{modelId}/revisions/1",
    expected: [401, 404, 200, 200, 200, 200, 200],
  },
  {
    method: "get",
    path: "/api/projects/{projectId}/models/{modelId}/revisions/1/export?format=rules",
    expected: [401, 404, 200, 200, 200, 200, 200],
  },
  {
    method: "get",
    path: "/api/projects/{projectId}/models/{modelId}/revisions/1/original",
    expected: [401, 404, 200, 200, 200, 200, 200],
  },
  {
    method: "get",
    path: "/api/projects/{projectId}/models/{modelId}/revisions/1/attractors",
    expected: [401, 404, 200, 200, 200, 200, 200],
  },
  {
    method: "post",
    path: "/api/projects/{projectId}/models/{modelId}/revisions/1/perturbation",
    body: () => ({ knockOut: ["A"] }),
    expected: [401, 404, 200, 200, 200, 200, 200],
    tokens: "read",
  },
  {
    method: "post",
    path: "/api/projects/{projectId}/models/{modelId}/revisions/1/trajectory",
    body: () => ({ initial: "01" }),
    expected: [401, 404, 200, 200, 200, 200, 200],
    tokens: "read",
  },
  {
    method: "get",
    path: "/api/projects/{projectId}/models/{modelId}/revisions/1/structure",
    expected: [401, 404, 200, 200, 200, 200, 200],
  },
  {
    method: "get",
    path: "/api/projects/{projectId}/models/{modelId}/expectations",
    expected: [401, 404, 200, 200, 200, 200, 200],
  },
  {
    method: "post",
    path: "/api/projects/{projectId}/models/{modelId}/expectations",
    body: () => ({ id: "matrix-new", outcome: { kind: "some-attractor", pattern: { A: 1 } }, source: "matrix" }),
    expected: [401, 404, 403, 403, 201, 201, 201],
  },
  {
    method: "get",
    path: "/api/projects/{projectId}/models/{modelId}/expectations/export",
    expected: [401, 404, 200, 200, 200, 200, 200],
  },
  {
    method: "post",
    path: "/api/projects/{projectId}/models/{modelId}/expectations/import",
    body: () => ({ csv: "id,outcome,pattern,source\nmatrix-csv,some-attractor,B=1,matrix\n" }),
    expected: [401, 404, 403, 403, 200, 200, 200],
  },
  {
    method: "get",
    path: "/api/projects/{projectId}/models/{modelId}/expectations/matrix",
    expected: [401, 404, 200, 200, 200, 200, 200],
  },
  {
    method: "post",
    path: "/api/projects/{projectId}/models/{modelId}/expectations/check",
    body: () => ({}),
    expected: [401, 404, 403, 403, 200, 200, 200],
  },
  {
    method: "patch",
    path: "/api/projects/{projectId}/models/{modelId}/expectations/{expectationId}",
    body: () => ({ id: "matrix-e", outcome: { kind: "no-attractor", pattern: { A: 1 } }, source: "matrix" }),
    expected: [401, 404, 403, 403, 200, 200, 200],
  },
  {
    method: "delete",
    path: "/api/projects/{projectId}/models/{modelId}/expectations/{expectationId}",
    expected: [401, 404, 403, 403, 204, 204, 204],
  },
  { method: "get", path: "/api/projects/{projectId}/reductions", expected: [401, 404, 200, 200, 200, 200, 200] },
  {
    method: "post",
    path: "/api/projects/{projectId}/reductions",
    body: (f) => ({ sourceModelId: f.modelId, certificate: f.certificate }),
    expected: [401, 404, 403, 403, 200, 200, 200],
  },
  {
    method: "post",
    path: "/api/projects/{projectId}/reductions/searches",
    body: (f) => ({ mode: "discover", sourceModelId: f.modelId, maxTargetNodes: 1 }),
    expected: [401, 404, 403, 403, 201, 201, 201],
  },
  {
    method: "post",
    path: "/api/projects/{projectId}/reductions/proposals",
    body: (f) => ({ runId: f.runId, rank: 0 }),
    // The fixture's run is no reduction search, so members who may start runs hear 404.
    expected: [401, 404, 403, 403, 404, 404, 404],
  },
  {
    method: "post",
    path: "/api/projects/{projectId}/reductions/reduced-models",
    body: (f) => ({ runId: f.eliminationRunId, name: "Matrix reduced" }),
    expected: [401, 404, 403, 403, 201, 201, 201],
  },
  {
    method: "post",
    path: "/api/projects/{projectId}/reductions/decisions",
    body: (f) => ({ decision: "approve", reductionIds: [f.reductionId] }),
    expected: [401, 404, 403, 200, 403, 200, 200],
  },
  {
    method: "get",
    path: "/api/projects/{projectId}/reductions/{reductionId}",
    expected: [401, 404, 200, 200, 200, 200, 200],
  },
  {
    method: "get",
    path: "/api/projects/{projectId}/reductions/{reductionId}/certificate",
    expected: [401, 404, 200, 200, 200, 200, 200],
  },
  {
    method: "post",
    path: "/api/projects/{projectId}/reductions/{reductionId}/decision",
    body: () => ({ decision: "approve", comment: "matrix" }),
    expected: [401, 404, 403, 200, 403, 200, 200],
  },
  {
    method: "post",
    path: "/api/projects/{projectId}/reductions/{reductionId}/verify",
    expected: [401, 404, 403, 200, 403, 200, 200],
  },
  {
    method: "post",
    path: "/api/projects/{projectId}/reductions/{reductionId}/comments",
    body: () => ({ body: "matrix comment" }),
    expected: [401, 404, 403, 201, 201, 201, 201],
  },
  {
    method: "post",
    path: "/api/projects/{projectId}/reductions/{reductionId}/save-target",
    body: () => ({ name: "Matrix target" }),
    expected: [401, 404, 403, 403, 201, 201, 201],
  },
  { method: "get", path: "/api/projects/{projectId}/model-hierarchy", expected: [401, 404, 200, 200, 200, 200, 200] },
  { method: "get", path: "/api/notifications", expected: [401, 200, 200, 200, 200, 200, 200] },
  { method: "get", path: "/api/notifications/preferences", expected: [401, 200, 200, 200, 200, 200, 200] },
  {
    method: "patch",
    path: "/api/notifications/preferences",
    body: () => ({ emailOnDecision: true, emailOnReviewWaiting: true, emailOnMention: false }),
    expected: [401, 200, 200, 200, 200, 200, 200],
  },
  {
    method: "post",
    path: "/api/notifications/read",
    body: () => ({ all: true }),
    expected: [401, 200, 200, 200, 200, 200, 200],
  },
  // automata: any signed-in user reads (block size 3 is computed inline in well under a second)
  { method: "get", path: "/api/automata/hierarchies", expected: [401, 200, 200, 200, 200, 200, 200] },
  { method: "get", path: "/api/automata/hierarchy?maxBlock=3", expected: [401, 200, 200, 200, 200, 200, 200] },
  { method: "get", path: "/api/automata/rules/18?maxBlock=3", expected: [401, 200, 200, 200, 200, 200, 200] },
  {
    method: "get",
    path: "/api/automata/witness?source=18&target=90&maxBlock=3",
    expected: [401, 200, 200, 200, 200, 200, 200],
  },
];

const t = buildTestApp();
const config = testConfig();
const userId = {} as Record<Exclude<Caller, "anonymous">, string>;
const emailOf = {} as Record<Exclude<Caller, "anonymous">, string>;
const cookieOf = {} as Record<Exclude<Caller, "anonymous">, string>;
const bearerOf = new Map<string, string>();
const tokenLabel = ([person, scope]: (typeof tokenCallers)[number]) => `${person} ${scope} token`;

/**
 * A token answers as its owner, with two limits: a read token gets 403 where writing is needed, and no token is
 * taken where the route wants a browser session. An administrator's token acts with member rights, so it answers
 * as a non-member would.
 */
function tokenExpected(row: Row, [person, scope]: (typeof tokenCallers)[number]): number {
  const needs = row.tokens ?? (row.method === "get" ? "read" : "write");
  if (needs === "none" || (needs === "write" && scope === "read")) return 403;
  return row.expected[callers.indexOf(person === "admin" ? "nonMember" : person)]!;
}
const runId = randomUUID().slice(0, 8);

async function insertUser(label: string, siteRole: "admin" | "member", passwordHash: string): Promise<string> {
  const [row] = await t
    .db("users")
    .insert({
      email: `matrix-${label.toLowerCase()}-${runId}@fixture.emulant.test`,
      display_name: `Matrix ${label}`,
      site_role: siteRole,
      password_hash: passwordHash,
    })
    .returning("id");
  return (row as { id: string }).id;
}

async function makeFixture(): Promise<Fixture> {
  const projectName = `Matrix project ${randomUUID().slice(0, 8)}`;
  const [project] = await t.db("projects").insert({ name: projectName }).returning("id");
  const projectId = (project as { id: string }).id;
  const passwordHash = await t.db("users").select("password_hash").where({ id: userId.viewer }).first();
  const targetUserId = await insertUser(
    `target-${randomUUID().slice(0, 8)}`,
    "member",
    (passwordHash as { password_hash: string }).password_hash,
  );
  await t.db("memberships").insert([
    { project_id: projectId, user_id: userId.viewer, role: "viewer" },
    { project_id: projectId, user_id: userId.reviewer, role: "reviewer" },
    { project_id: projectId, user_id: userId.modeler, role: "modeler" },
    { project_id: projectId, user_id: userId.owner, role: "owner" },
    { project_id: projectId, user_id: targetUserId, role: "viewer" },
  ]);
  const pending = newInvitationToken();
  const accept = newInvitationToken();
  const expiresAt = new Date(Date.now() + 3_600_000);
  const [invitation] = await t
    .db("invitations")
    .insert({
      project_id: projectId,
      email: `pending-${randomUUID().slice(0, 8)}@fixture.emulant.test`,
      role: "viewer",
      token_hash: pending.tokenHash,
      invited_by: userId.owner,
      expires_at: expiresAt,
    })
    .returning("id");
  await t.db("invitations").insert({
    project_id: projectId,
    email: `invitee-${randomUUID().slice(0, 8)}@fixture.emulant.test`,
    role: "viewer",
    token_hash: accept.tokenHash,
    invited_by: userId.owner,
    expires_at: expiresAt,
  });
  // Runs without shards: no worker ever picks them up, so their state is what the cell expects.
  const run = {
    project_id: projectId,
    kind: "sleep-count",
    params: JSON.stringify({ itemCount: 1 }),
    params_hash: "matrix",
    time_limit_seconds: 60,
    shard_count: 0,
  };
  const [queuedRun] = await t
    .db("runs")
    .insert({ ...run, state: "queued" })
    .returning("id");
  const [failedRun] = await t
    .db("runs")
    .insert({ ...run, state: "failed", error: JSON.stringify({ code: "MATRIX", message: "failed for the matrix" }) })
    .returning("id");
  const modelId = await insertMatrixModel(projectId);
  const { reductionId, certificate } = await insertMatrixReduction(projectId, modelId);
  const eliminationRunId = await insertEliminationRun(projectId, modelId);
  const [expectation] = await t
    .db("expectations")
    .insert({
      model_id: modelId,
      key: "matrix-e",
      body: JSON.stringify({
        update: "synchronous",
        condition: { knockOut: [], overExpress: [], inputs: {} },
        outcome: { kind: "some-attractor", pattern: { A: 1 } },
      }),
      body_hash: "matrix",
      source: "matrix fixture",
    })
    .returning("id");
  return {
    modelId,
    expectationId: (expectation as { id: string }).id,
    reductionId,
    certificate,
    runId: (queuedRun as { id: string }).id,
    failedRunId: (failedRun as { id: string }).id,
    eliminationRunId,
    projectId,
    projectName,
    targetUserId,
    invitationId: (invitation as { id: string }).id,
    token: accept.token,
    unknownTokenId: randomUUID(),
    freshEmail: `fresh-${randomUUID().slice(0, 8)}@fixture.emulant.test`,
  };
}

async function insertMatrixModel(projectId: string): Promise<string> {
  const toggle = {
    nodes: [
      { name: "A", rule: { kind: "not", arg: { kind: "var", name: "B" } } },
      { name: "B", rule: { kind: "not", arg: { kind: "var", name: "A" } } },
    ],
  };
  const [model] = await t
    .db("models")
    .insert({ project_id: projectId, name: "Matrix toggle", created_by: userId.modeler })
    .returning("id");
  const modelId = (model as { id: string }).id;
  const [revision] = await t
    .db("model_revisions")
    .insert({
      model_id: modelId,
      revision: 1,
      definition: JSON.stringify(toggle),
      rule_text: "A' = !B\nB' = !A\n",
      node_count: 2,
      source: "rules",
      created_by: userId.modeler,
      network_summary: JSON.stringify({ nodes: ["A", "B"], edgeCount: 2, inputs: [], thresholdNodes: [] }),
    })
    .returning("id");
  const bytes = Buffer.from("A' = !B\nB' = !A\n");
  await t.db("model_files").insert({
    revision_id: (revision as { id: string }).id,
    file_name: "toggle.rules",
    media_type: "text/plain",
    bytes,
    size_bytes: bytes.length,
  });
  return modelId;
}

/**
 * The toggle A' = !B, B' = !A emulates X' = !X at t = 1 with the block {A, B} and codewords 00 / 11 (00 -> 11 -> 00);
 * stored as a proposed reduction onto an unsaved target.
 */
async function insertMatrixReduction(
  projectId: string,
  modelId: string,
): Promise<{ reductionId: string; certificate: Certificate }> {
  const revision = (await t
    .db("model_revisions")
    .where({ model_id: modelId, revision: 1 })
    .first("id", "rule_text")) as { id: string; rule_text: string };
  const net = compileDefinition(readRuleText(revision.rule_text));
  const oscillator = compileDefinition(readRuleText("X' = !X\n"));
  const certificate = blockEmulationCertificate(net, oscillator, {
    time: 1,
    blocks: [{ nodes: [0, 1], zero: [0, 0], one: [1, 1] }],
    context: [-1, -1],
  }) as Certificate;
  const stored = await insertReduction(t.db, {
    projectId,
    sourceRevisionId: revision.id,
    targetRevisionId: null,
    notion: "block-emulation",
    timeScale: 1,
    certificate,
    targetKey: statementKey(certificate, null),
    flags: [],
    foundBy: userId.modeler,
    foundInRunId: null,
  });
  return { reductionId: stored.id, certificate };
}

/** A finished node-elimination run of the toggle: eliminating A leaves B' = B (the result the worker would store). */
async function insertEliminationRun(projectId: string, modelId: string): Promise<string> {
  const revision = (await t
    .db("model_revisions")
    .where({ model_id: modelId, revision: 1 })
    .first("id", "rule_text")) as { id: string; rule_text: string };
  const net = compileDefinition(readRuleText(revision.rule_text));
  const reduced = eliminateNodes(net, ["A"]);
  const result: NodeEliminationResult = {
    mode: "nodes",
    nodesBefore: 2,
    nodesAfter: 1,
    eliminated: reduced.eliminated,
    kept: [...reduced.network.names],
    notEliminated: [{ node: "B", reason: "regulates itself" }],
    fixed: [],
    held: [],
    ruleText: printRuleText(networkToDefinition(reduced.network)),
    preserves: reduced.preserves,
    certificate: eliminationCertificate(net, reduced.network, reduced.eliminated) as Certificate,
    certificateNote: null,
  };
  const [run] = await t
    .db("runs")
    .insert({
      project_id: projectId,
      model_revision_id: revision.id,
      kind: "node-elimination",
      params: JSON.stringify({ mode: "nodes", nodes: ["A"] }),
      params_hash: "matrix-elimination",
      time_limit_seconds: 60,
      shard_count: 0,
      state: "succeeded",
      result: JSON.stringify(result),
    })
    .returning("id");
  return (run as { id: string }).id;
}

beforeAll(async () => {
  const passwordHash = await hashPassword(PASSWORD);
  for (const caller of callers) {
    if (caller === "anonymous") continue;
    userId[caller] = await insertUser(caller, caller === "admin" ? "admin" : "member", passwordHash);
    emailOf[caller] = `matrix-${caller.toLowerCase()}-${runId}@fixture.emulant.test`;
    // Tokens are minted directly: the matrix is about authorisation, sign-in itself is tested in accounts.test.ts.
    cookieOf[caller] = await sessionCookieFor(t.db, config.sessionSecret, userId[caller]);
  }
  for (const tc of tokenCallers) {
    const { token, tokenHash } = newAccessTokenSecret();
    const [person, scope] = tc;
    const expiresAt = new Date(Date.now() + 86_400_000);
    await insertAccessToken(t.db, {
      userId: userId[person],
      name: "matrix",
      scope,
      projectIds: null,
      expiresAt,
      tokenHash,
    });
    bearerOf.set(tokenLabel(tc), token);
  }
});
afterAll(() => t.close());

function fill(path: string, f: Fixture): string {
  return path.replace(/\{(\w+)\}/g, (_m, key: string) => {
    if (!(key in f)) throw new Error(`No fixture value for {${key}} in ${path}`);
    return String(f[key as keyof Fixture]);
  });
}

describe("role matrix", () => {
  it("has exactly one row per method and path", () => {
    const keys = rows.map((r) => `${r.method} ${r.path}`);
    expect(new Set(keys).size).toBe(keys.length);
  });

  // The registry lists every route the app serves, with the access it declares: the table must cover them all.
  const declared = routeRegistry(t.app).routes.map((r) => ({
    ...r,
    pattern: new RegExp(`^${r.openApiPath.replace(/\{\w+\}/g, "[^/]+")}$`),
  }));
  const declaredFor = (row: Row) =>
    declared.find((r) => r.method === row.method && r.pattern.test(row.path.split("?")[0]!));

  it("has a row for every route in the route registry, and no row for a route it does not list", () => {
    const missing = declared.filter(
      (r) => !rows.some((row) => row.method === r.method && r.pattern.test(row.path.split("?")[0]!)),
    );
    expect(missing.map((r) => `${r.method.toUpperCase()} ${r.openApiPath}`)).toEqual([]);
    expect(rows.filter((row) => !declaredFor(row)).map((row) => `${row.method} ${row.path}`)).toEqual([]);
  });

  it("answers anonymous callers and non-members as each route's declared access says", () => {
    // Public routes let both in; signed-in routes stop only the anonymous; admin routes refuse members with 403;
    // project routes hide the project from non-members behind a 404.
    const firstTwo = { user: [401, null], "site-admin": [401, 403], project: [401, 404] } as const;
    for (const row of rows) {
      const access = declaredFor(row)!.access.kind;
      const [anonymous, nonMember] = row.expected;
      if (access === "public") {
        expect([anonymous, nonMember], `${row.method} ${row.path}`).not.toContain(401);
        continue;
      }
      const [a, m] = firstTwo[access];
      expect(anonymous, `${row.method} ${row.path}`).toBe(a);
      if (m !== null) expect(nonMember, `${row.method} ${row.path}`).toBe(m);
      else expect(nonMember, `${row.method} ${row.path}`).not.toBe(401);
    }
  });

  for (const row of rows) {
    it(`${row.method.toUpperCase()} ${row.path} answers ${row.expected.join("/")} for ${callers.join("/")}`, async () => {
      const actual: Record<string, number> = {};
      const expected: Record<string, number> = {};
      for (const [i, caller] of callers.entries()) {
        const f = await makeFixture();
        let req = request(t.app)[row.method](fill(row.path, f));
        if (caller !== "anonymous")
          req = req.set(
            "Cookie",
            row.ownSession ? await sessionCookieFor(t.db, config.sessionSecret, userId[caller]) : cookieOf[caller],
          );
        const res = row.body ? await req.send(row.body(f)) : await req;
        actual[caller] = res.status;
        expected[caller] = row.expected[i]!;
      }
      expect(actual).toEqual(expected);
    });

    it(`${row.method.toUpperCase()} ${row.path} answers access-token callers as their owners, within their scope`, async () => {
      const actual: Record<string, number> = {};
      const expected: Record<string, number> = {};
      for (const tc of tokenCallers) {
        const f = await makeFixture();
        // A foreign Origin too: token requests skip the origin check meant for cookies.
        const req = request(t.app)
          [row.method](fill(row.path, f))
          .set("Authorization", `Bearer ${bearerOf.get(tokenLabel(tc))}`)
          .set("Origin", "https://notebook.example");
        const res = row.body ? await req.send(row.body(f)) : await req;
        actual[tokenLabel(tc)] = res.status;
        expected[tokenLabel(tc)] = tokenExpected(row, tc);
      }
      expect(actual).toEqual(expected);
    });
  }
});

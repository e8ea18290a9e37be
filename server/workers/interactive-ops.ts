// The request work whose cost grows with the input, as plain functions of cloneable values, so that the interactive
// pool (interactive-pool.ts) can run them in a thread and small inputs can still run them in place.
import { verifyCertificate } from "@shared/engine/certificates";
import type { HierarchyParameters } from "@shared/schemas/automata";
import { computeHierarchyRecord } from "../services/automata/eca-hierarchy-compute";
import { readUpload } from "../services/models/model-formats";
import { readRules, validateRuleText } from "../services/models/model-reading";
import { revisionStructure, revisionTrajectory } from "../services/models/revision-analyses";

export const interactiveOps = {
  validateRuleText,
  readRules,
  readUpload: (fileName: string, bytes: Uint8Array) => readUpload(fileName, Buffer.from(bytes)),
  revisionStructure,
  revisionTrajectory,
  verifyCertificate,
  computeHierarchyRecord: (key: HierarchyParameters, computedBy: string | null) =>
    computeHierarchyRecord(key, { computedBy }),
};

export type InteractiveOps = typeof interactiveOps;
export type InteractiveOp = keyof InteractiveOps;

export interface InteractiveCall {
  op: InteractiveOp;
  args: unknown[];
}

/** An HttpError crosses the thread boundary as data; any other failure is re-thrown on the other side as it is. */
export type InteractiveAnswer =
  | { ok: true; value: unknown }
  | { ok: false; error: { status: number; code: string; message: string; details?: unknown } };

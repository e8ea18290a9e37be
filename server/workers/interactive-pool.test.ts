import { afterAll, describe, expect, it } from "vitest";
import { HttpError } from "../http/errors";
import { closeInteractivePool, interactiveLimits, offThread } from "./interactive-pool";

afterAll(() => closeInteractivePool());

const limit = interactiveLimits.INTERACTIVE_TIME_LIMIT_MS;

describe("offThread", () => {
  it("answers the operation's value, and its HttpError as the same HttpError", async () => {
    const ok = await offThread("validateRuleText", "A' = !B\nB' = A\n");
    expect(ok).toMatchObject({ ok: true, nodeCount: 2, nodes: ["A", "B"] });
    const failed = await offThread("readRules", "A' = B &\n").catch((e: unknown) => e);
    expect(failed).toBeInstanceOf(HttpError);
    expect(failed).toMatchObject({ status: 400, code: "PARSE_ERROR" });
  }, 60_000);

  it("stops a call over the time limit and answers 422 WORK_LIMIT, then serves the next call", async () => {
    const n = 20_000;
    const dense = Array.from(
      { length: n },
      (_, i) => `N${i}' = ${Array.from({ length: 12 }, (_, k) => `N${(i + k + 1) % n}`).join(" & ")}`,
    ).join("\n");
    interactiveLimits.INTERACTIVE_TIME_LIMIT_MS = 150;
    const stopped = await offThread("validateRuleText", dense)
      .catch((e: unknown) => e)
      .finally(() => (interactiveLimits.INTERACTIVE_TIME_LIMIT_MS = limit));
    expect(stopped).toBeInstanceOf(HttpError);
    expect(stopped).toMatchObject({ status: 422, code: "WORK_LIMIT" });
    expect(await offThread("validateRuleText", "A' = A\n")).toMatchObject({ ok: true });
  }, 60_000);
});

import type { Request, Response } from "express";
import pino from "pino";
import { describe, expect, it } from "vitest";
import { errorHandler, HttpError } from "./errors";

function answer(err: unknown): { status: number; body: { error: { message: string; details?: unknown } } } {
  const out = { status: 0, body: undefined as never };
  const res = {
    status(code: number) {
      out.status = code;
      return this;
    },
    json(body: never) {
      out.body = body;
      return this;
    },
  } as unknown as Response;
  errorHandler(pino({ level: "silent" }))(err, { id: "r1" } as Request, res, () => {});
  return out;
}

describe("errorHandler", () => {
  it("escapes control characters and half surrogate pairs in messages and detail messages", () => {
    const quoted = "A\u0007\u001b[31m\ud800B";
    const res = answer(
      new HttpError(400, "INVALID_INPUT", `No node named "${quoted}"`, [{ field: "body.x", message: quoted }]),
    );
    expect(res.status).toBe(400);
    expect(res.body.error.message).toBe('No node named "A\\u0007\\u001B[31m\\uD800B"');
    expect(res.body.error.details).toEqual([{ field: "body.x", message: "A\\u0007\\u001B[31m\\uD800B" }]);
  });

  it("keeps ordinary text, accents and whole emoji as they are", () => {
    const text = "Gène ΔcycA 🌱 — fine";
    expect(answer(new HttpError(404, "NOT_FOUND", text)).body.error.message).toBe(text);
  });

  it("answers 500 with the request id, never the internal message, for an unknown error", () => {
    const res = answer(new Error("secret stack detail"));
    expect(res.status).toBe(500);
    expect(res.body.error.message).toBe("Something went wrong on our side (request r1)");
  });
});

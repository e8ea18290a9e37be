import { describe, expect, it } from "vitest";
import { z } from "zod";
import { fieldLabel, issueSentence } from "./issue-words";

const sentences = (schema: z.ZodType, value: unknown) => {
  const r = schema.safeParse(value);
  if (r.success) throw new Error("expected a failure");
  return r.error.issues.map((i) => `${fieldLabel(["body", ...i.path].join("."))}: ${issueSentence(i)}`);
};

describe("issue words", () => {
  it("names the field as a person reads it", () => {
    expect(fieldLabel("body.observe")).toBe("Observe");
    expect(fieldLabel("body.maxTargetNodes")).toBe("Max target nodes");
    expect(fieldLabel("body.certificate.target.nodes.0")).toBe("Certificate target nodes, item 1");
    expect(fieldLabel("body")).toBe("The request");
  });

  it("turns zod's default messages into sentences about the field", () => {
    const s = z.object({
      observe: z.array(z.string()).min(1),
      maxTime: z.number().int().min(1).max(8),
      name: z.string().min(1),
      sourceModelId: z.uuid(),
      mode: z.enum(["discover", "coarse-grain"]),
    });
    expect(sentences(s, { observe: [], maxTime: 9, name: "", sourceModelId: "x", mode: "y" })).toEqual([
      "Observe: choose at least one",
      "Max time: must be at most 8",
      "Name: fill this in",
      "Source model id: must be the id of an existing item",
      'Mode: must be one of "discover", "coarse-grain"',
    ]);
    expect(sentences(z.object({ time: z.number() }), {})).toEqual(["Time: is required"]);
  });

  it("keeps a message the schema wrote itself", () => {
    expect(sentences(z.object({ body: z.string().min(1, "a comment cannot be empty") }), { body: "" })).toEqual([
      "Body: a comment cannot be empty",
    ]);
  });
});

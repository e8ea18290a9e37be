// zod at the edge: parsed values replace the raw ones so handlers only see validated data.
import type { RequestHandler } from "express";
import type { z } from "zod";
import { HttpError } from "./errors";

interface Schemas {
  params?: z.ZodType;
  query?: z.ZodType;
  body?: z.ZodType;
}

export function validate(schemas: Schemas): RequestHandler {
  return (req, _res, next) => {
    for (const part of ["params", "query", "body"] as const) {
      const schema = schemas[part];
      if (!schema) continue;
      const result = schema.safeParse(req[part] ?? {});
      if (!result.success) {
        const details = result.error.issues.map((i) => ({ field: [part, ...i.path].join("."), message: i.message }));
        const first = details[0]!;
        return next(new HttpError(400, "INVALID_INPUT", `${first.field}: ${first.message}`, details));
      }
      // Express 5 makes req.query a getter; define the parsed value on the request instead of assigning.
      Object.defineProperty(req, part, { value: result.data, writable: true, configurable: true, enumerable: true });
    }
    next();
  };
}

// The API reference, drawn from the server's own OpenAPI document: operations grouped by resource, each with who
// may call it, its parameters, and the outline of its request and answer schemas.
import { useState } from "react";
import type { JsonSchema, OpenApiOutline, Operation } from "../api/get-openapi";

const methodColour: Record<string, string> = {
  get: "bg-sky-100 text-sky-800",
  post: "bg-emerald-100 text-emerald-800",
  patch: "bg-amber-100 text-amber-800",
  put: "bg-amber-100 text-amber-800",
  delete: "bg-red-100 text-red-800",
};

type Schemas = Record<string, JsonSchema>;

function resolve(schema: JsonSchema, schemas: Schemas): JsonSchema {
  const ref = schema.$ref;
  return typeof ref === "string" ? (schemas[ref.split("/").pop()!] ?? {}) : schema;
}

function typeLabel(schema: JsonSchema, schemas: Schemas): string {
  const s = resolve(schema, schemas);
  if (Array.isArray(s.enum)) return s.enum.map((v) => JSON.stringify(v)).join(" | ");
  if ("const" in s) return JSON.stringify(s.const);
  const options = (s.anyOf ?? s.oneOf) as JsonSchema[] | undefined;
  if (options) return options.map((o) => typeLabel(o, schemas)).join(" | ");
  if (s.type === "array" && s.items) return `${typeLabel(s.items as JsonSchema, schemas)}[]`;
  if (Array.isArray(s.type)) return s.type.join(" | ");
  return typeof s.type === "string" ? s.type : "any";
}

/** Nested objects and arrays of objects open one level at a time; recursive schemas stop at a depth. */
function SchemaOutline({ schema, schemas, depth = 0 }: { schema: JsonSchema; schemas: Schemas; depth?: number }) {
  let s = resolve(schema, schemas);
  while (s.type === "array" && s.items) s = resolve(s.items as JsonSchema, schemas);
  const options = (s.anyOf ?? s.oneOf) as JsonSchema[] | undefined;
  if (options && depth < 6) {
    const objects = options.filter((o) => resolve(o, schemas).properties);
    if (objects.length)
      return (
        <div className="space-y-1">
          {objects.map((o, i) => (
            <div key={i} className="border-l-2 border-slate-200 pl-2">
              <span className="text-xs text-slate-500">one of:</span>
              <SchemaOutline schema={o} schemas={schemas} depth={depth + 1} />
            </div>
          ))}
        </div>
      );
  }
  const properties = s.properties as Record<string, JsonSchema> | undefined;
  if (!properties || depth > 6) return null;
  const required = new Set((s.required as string[] | undefined) ?? []);
  return (
    <ul className="space-y-0.5 font-mono text-xs">
      {Object.entries(properties).map(([name, sub]) => (
        <li key={name}>
          <span className="text-slate-900">{name}</span>
          {!required.has(name) && <span className="text-slate-400">?</span>}
          <span className="text-slate-500">: {typeLabel(sub, schemas)}</span>
          <div className="ml-4">
            <SchemaOutline schema={sub} schemas={schemas} depth={depth + 1} />
          </div>
        </li>
      ))}
    </ul>
  );
}

function OperationCard({
  method,
  path,
  op,
  schemas,
}: {
  method: string;
  path: string;
  op: Operation;
  schemas: Schemas;
}) {
  const [open, setOpen] = useState(false);
  const body = op.requestBody && Object.entries(op.requestBody.content)[0];
  return (
    <li className="rounded-md border border-slate-200 bg-white">
      <button
        type="button"
        className="flex w-full items-center gap-3 px-3 py-2 text-left"
        aria-expanded={open}
        onClick={() => setOpen(!open)}
      >
        <span
          className={`w-16 rounded px-1.5 py-0.5 text-center text-xs font-semibold uppercase ${methodColour[method] ?? ""}`}
        >
          {method}
        </span>
        <code className="text-sm">{path}</code>
        <span className="ml-auto text-sm text-slate-600">{op.summary}</span>
      </button>
      {open && (
        <div className="space-y-3 border-t border-slate-100 px-3 py-3 text-sm">
          {op.description && <p className="text-slate-600">{op.description}</p>}
          {op.parameters && op.parameters.length > 0 && (
            <div>
              <h4 className="font-medium">Parameters</h4>
              <ul className="font-mono text-xs">
                {op.parameters.map((p) => (
                  <li key={`${p.in}-${p.name}`}>
                    {p.name}
                    {!p.required && <span className="text-slate-400">?</span>}
                    <span className="text-slate-500">
                      {" "}
                      ({p.in}): {p.schema ? typeLabel(p.schema, schemas) : "any"}
                    </span>
                  </li>
                ))}
              </ul>
            </div>
          )}
          {body && (
            <div>
              <h4 className="font-medium">Request body ({body[0]})</h4>
              {body[1].schema && <SchemaOutline schema={body[1].schema} schemas={schemas} />}
            </div>
          )}
          {Object.entries(op.responses).map(([status, r]) => {
            const content = r.content && Object.entries(r.content)[0];
            return (
              <div key={status}>
                <h4 className="font-medium">
                  {status} {r.description}
                  {content && <span className="font-normal text-slate-500"> · {content[0]}</span>}
                </h4>
                {content?.[1].schema && <SchemaOutline schema={content[1].schema} schemas={schemas} />}
              </div>
            );
          })}
        </div>
      )}
    </li>
  );
}

export function ApiReference({ document }: { document: OpenApiOutline }) {
  const schemas = (document.components?.schemas ?? {}) as Schemas;
  const byTag = new Map<string, { method: string; path: string; op: Operation }[]>();
  for (const [path, ops] of Object.entries(document.paths))
    for (const [method, op] of Object.entries(ops)) {
      const tag = op.tags?.[0] ?? "other";
      byTag.set(tag, [...(byTag.get(tag) ?? []), { method, path, op }]);
    }
  return (
    <div className="space-y-6">
      {[...byTag].map(([tag, ops]) => (
        <section key={tag} aria-label={tag}>
          <h2 className="mb-2 text-lg font-semibold capitalize">{tag}</h2>
          <ul className="space-y-1.5">
            {ops.map((o) => (
              <OperationCard key={`${o.method} ${o.path}`} {...o} schemas={schemas} />
            ))}
          </ul>
        </section>
      ))}
    </div>
  );
}

// The remote commands' HTTP client: every call carries the access token from EMULANT_TOKEN, answers are parsed with
// the same zod schemas the server declares, and an API error becomes a CommandError naming its code and fields.
import { z } from "zod";
import { ApiErrorBody } from "@shared/schemas/api-error";
import { CommandError, UsageError } from "./cli-io";

export interface Remote {
  server: string;
  token: string;
}

export function remoteFrom(server: string | undefined, env: NodeJS.ProcessEnv = process.env): Remote {
  if (!server) throw new UsageError("--server URL is required (the address of an Emulant server)");
  let url: URL;
  try {
    url = new URL(server);
  } catch {
    throw new UsageError(`--server must be a URL such as http://127.0.0.1:3000, got "${server}"`);
  }
  const token = env.EMULANT_TOKEN;
  if (!token) throw new UsageError("set EMULANT_TOKEN to a personal access token (profile page → Access tokens)");
  return { server: url.origin, token };
}

async function send(remote: Remote, path: string, init: RequestInit = {}): Promise<Response> {
  let res: Response;
  try {
    res = await fetch(`${remote.server}/api${path}`, {
      ...init,
      headers: { Accept: "application/json", Authorization: `Bearer ${remote.token}`, ...init.headers },
    });
  } catch (err) {
    throw new CommandError(`cannot reach ${remote.server}: ${(err as Error).cause ?? (err as Error).message}`);
  }
  if (res.ok) return res;
  const body = ApiErrorBody.safeParse(await res.json().catch(() => null));
  if (!body.success) throw new CommandError(`${init.method ?? "GET"} ${path}: the server answered ${res.status}`);
  const { code, message, details } = body.data.error;
  const fields = Array.isArray(details)
    ? (details as { field?: string; message?: string }[])
        .filter((d) => d.field)
        .map((d) => `\n  ${d.field}: ${d.message}`)
        .join("")
    : "";
  throw new CommandError(`${res.status} ${code}: ${message}${fields}`);
}

export async function remoteJson<S extends z.ZodType>(
  remote: Remote,
  path: string,
  schema: S,
  init: RequestInit & { json?: unknown } = {},
): Promise<z.infer<S>> {
  const { json, ...rest } = init;
  const res = await send(
    remote,
    path,
    json === undefined
      ? rest
      : { ...rest, body: JSON.stringify(json), headers: { "Content-Type": "application/json", ...rest.headers } },
  );
  const parsed = z.object({ data: schema }).safeParse(await res.json().catch(() => null));
  if (!parsed.success) throw new CommandError(`${path}: the server's answer is not what this client expects`);
  return (parsed.data as { data: z.infer<S> }).data;
}

/** A download: the answer's body as text. */
export async function remoteText(remote: Remote, path: string): Promise<string> {
  return (await send(remote, path)).text();
}

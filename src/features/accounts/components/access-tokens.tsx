// Personal access tokens on the profile page: create one (its secret is shown once, here), see each token's scope,
// projects, expiry and last use, and revoke it. The projects to choose from come from the screen that composes this.
import { useState, type FormEvent } from "react";
import { NewAccessTokenBody, type AccessToken, type TokenScope } from "@shared/schemas/access-tokens";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/text-field";
import { useCreateToken } from "../api/create-token";
import { useTokens } from "../api/list-tokens";
import { useRevokeToken } from "../api/revoke-token";

export interface TokenProjectChoice {
  id: string;
  name: string;
}

const day = (iso: string) => new Date(iso).toLocaleDateString();

function tokenState(t: AccessToken): string {
  if (t.revokedAt) return `revoked ${day(t.revokedAt)}`;
  if (new Date(t.expiresAt) < new Date()) return `expired ${day(t.expiresAt)}`;
  return `expires ${day(t.expiresAt)}`;
}

export function AccessTokens({ projects }: { projects: readonly TokenProjectChoice[] }) {
  const tokens = useTokens();
  const create = useCreateToken();
  const revoke = useRevokeToken();
  const [name, setName] = useState("");
  const [scope, setScope] = useState<TokenScope>("read");
  const [days, setDays] = useState("30");
  const [chosen, setChosen] = useState<string[]>([]);
  const [error, setError] = useState<string | null>(null);
  const [secret, setSecret] = useState<string | null>(null);
  const projectName = new Map(projects.map((p) => [p.id, p.name]));

  async function submit(e: FormEvent) {
    e.preventDefault();
    setError(null);
    const parsed = NewAccessTokenBody.safeParse({
      name,
      scope,
      expiresInDays: Number(days),
      projectIds: chosen.length ? chosen : null,
    });
    if (!parsed.success) return setError(parsed.error.issues[0]!.message);
    try {
      const created = await create.mutateAsync(parsed.data);
      setSecret(created.token);
      setName("");
      setChosen([]);
    } catch (err) {
      setError((err as Error).message);
    }
  }

  return (
    <div className="space-y-4">
      <p className="text-sm text-slate-600">
        Scripts and the remote command line sign in with a token sent as <code>Authorization: Bearer …</code>. A token
        acts as you, never with more than your role in a project, and never with site-administrator rights.
      </p>
      {secret && (
        <Alert tone="success">
          Copy this token now; it is not shown again.
          <code className="mt-2 block break-all rounded bg-white p-2 font-mono text-xs" aria-label="New token">
            {secret}
          </code>
        </Alert>
      )}
      <form onSubmit={submit} noValidate className="space-y-3" aria-label="New access token">
        <TextField label="Token name" maxLength={120} value={name} onChange={(e) => setName(e.target.value)} />
        <div className="flex gap-4">
          <label className="block text-sm font-medium text-slate-700">
            Scope
            <select
              className="mt-1 block rounded-md border border-slate-300 px-2 py-1.5"
              value={scope}
              onChange={(e) => setScope(e.target.value as TokenScope)}
            >
              <option value="read">read</option>
              <option value="write">read and write</option>
            </select>
          </label>
          <TextField
            label="Expires after (days)"
            type="number"
            min={1}
            max={366}
            value={days}
            onChange={(e) => setDays(e.target.value)}
          />
        </div>
        {projects.length > 0 && (
          <fieldset className="text-sm">
            <legend className="font-medium text-slate-700">Limit to projects (none chosen: all your projects)</legend>
            {projects.map((p) => (
              <label key={p.id} className="mr-4 inline-flex items-center gap-1">
                <input
                  type="checkbox"
                  checked={chosen.includes(p.id)}
                  onChange={(e) => setChosen(e.target.checked ? [...chosen, p.id] : chosen.filter((x) => x !== p.id))}
                />
                {p.name}
              </label>
            ))}
          </fieldset>
        )}
        {error && <Alert>{error}</Alert>}
        <Button type="submit" disabled={create.isPending}>
          Create token
        </Button>
      </form>
      {tokens.error && <Alert>{tokens.error.message}</Alert>}
      {tokens.data && tokens.data.length > 0 && (
        <table className="w-full text-left text-sm">
          <thead className="text-slate-500">
            <tr>
              <th className="py-1">Name</th>
              <th>Scope</th>
              <th>Projects</th>
              <th>Last used</th>
              <th>State</th>
              <th />
            </tr>
          </thead>
          <tbody>
            {tokens.data.map((t) => (
              <tr key={t.id} className="border-t border-slate-100">
                <td className="py-1.5">{t.name}</td>
                <td>{t.scope === "write" ? "read and write" : "read"}</td>
                <td>{t.projectIds ? t.projectIds.map((id) => projectName.get(id) ?? id).join(", ") : "all"}</td>
                <td>{t.lastUsedAt ? new Date(t.lastUsedAt).toLocaleString() : "never"}</td>
                <td>{tokenState(t)}</td>
                <td className="text-right">
                  {!t.revokedAt && (
                    <Button variant="secondary" size="sm" onClick={() => revoke.mutate(t.id)}>
                      Revoke
                    </Button>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </div>
  );
}

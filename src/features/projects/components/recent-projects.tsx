// The signed-in front page's list of projects: the few most recently changed, each with the caller's role, so the
// usual next click (back into the project one was working on) is one click away.
import { Link } from "react-router-dom";
import { Alert } from "@/components/ui/alert";
import { plural } from "@/lib/plural";
import { useProjects } from "../api/list-projects";

const SHOWN = 6;

export function RecentProjects() {
  const { data, error, isPending } = useProjects();
  if (isPending) return <p className="text-sm text-slate-500">Loading your projects…</p>;
  if (error) return <Alert>Your projects could not be loaded: {error.message}</Alert>;
  const active = data.filter((p) => !p.archived).sort((a, b) => b.updatedAt.localeCompare(a.updatedAt));
  return (
    <section className="space-y-2" data-testid="recent-projects">
      <h2 className="text-sm font-semibold text-slate-900">Your projects</h2>
      {active.length === 0 ? (
        <p className="text-sm text-slate-600">
          You are in no active project yet.{" "}
          <Link to="/projects" className="font-medium text-brand-700 hover:underline">
            Create one
          </Link>{" "}
          or ask a project owner to invite you.
        </p>
      ) : (
        <ul className="divide-y divide-slate-100 rounded-lg border border-slate-200 bg-white">
          {active.slice(0, SHOWN).map((p) => (
            <li key={p.id} className="flex items-baseline justify-between gap-4 px-4 py-2 text-sm">
              <Link to={`/projects/${p.id}`} className="font-medium text-brand-700 hover:underline">
                {p.name}
              </Link>
              <span className="text-xs text-slate-600">
                {p.role ?? "site admin"} · {plural(p.memberCount, "member")} · changed{" "}
                <time dateTime={p.updatedAt}>{new Date(p.updatedAt).toLocaleDateString()}</time>
              </span>
            </li>
          ))}
        </ul>
      )}
      <p className="text-sm">
        <Link to="/projects" className="font-medium text-brand-700 hover:underline">
          {active.length > SHOWN ? `All ${active.length} projects` : "All projects"}
        </Link>
      </p>
    </section>
  );
}

// The front page: what Emulant is; for a visitor who is not signed in, how to get in; for someone signed in, their
// recently changed projects and what waits for them.
import { Link } from "react-router-dom";
import { useSession } from "@/features/accounts/api/get-session";
import { RecentProjects } from "@/features/projects/components/recent-projects";
import { RecentNotifications } from "@/features/runs";

export function HomeRoute() {
  const session = useSession();
  const user = session.data?.user ?? null;
  return (
    <section className="space-y-4">
      <h1 className="text-2xl font-semibold">Find the smaller network your model behaves like</h1>
      <p className="max-w-3xl text-slate-600">
        Emulant analyses Boolean models of regulatory networks: their attractors and basins, how knock-outs change them,
        and which smaller networks they emulate or coarse-grain onto. Every reduction comes with a certificate that
        anyone can re-verify, and a team reviews each one before it counts. A reduction is a statement about the model,
        not about the cell: Emulant is a research aid, not clinical advice.
      </p>
      {session.data && !user && (
        <div
          className="max-w-3xl space-y-2 rounded-lg border border-slate-200 bg-white p-4"
          data-testid="signed-out-intro"
        >
          <p className="text-sm text-slate-700">
            Work happens in projects: import or write a model, run analyses and reduction searches, and review what is
            found with your team. Sign in with your e-mail address and password to see your projects; a project owner
            invites you by e-mail, or you create an account and start your own project.
          </p>
          <p className="flex gap-3 text-sm">
            <Link to="/sign-in" className="font-medium text-brand-700 hover:underline">
              Sign in
            </Link>
            <Link to="/sign-up" className="font-medium text-brand-700 hover:underline">
              Create an account
            </Link>
          </p>
        </div>
      )}
      {user && (
        <div className="grid max-w-5xl gap-6 md:grid-cols-2">
          <RecentProjects />
          <RecentNotifications />
        </div>
      )}
    </section>
  );
}

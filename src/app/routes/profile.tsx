import { Alert } from "@/components/ui/alert";
import { useProfile } from "@/features/accounts/api/get-profile";
import { AccessTokens } from "@/features/accounts/components/access-tokens";
import { DisplayNameForm, PasswordForm } from "@/features/accounts/components/profile-forms";
import { useProjects } from "@/features/projects/api/list-projects";
import { NotificationSettings } from "@/features/runs";

export function ProfileRoute() {
  const { data: profile, error, isPending } = useProfile();
  const projects = useProjects();
  if (isPending) return <p className="text-sm text-slate-500">Loading…</p>;
  if (error) return <Alert>{error.message}</Alert>;
  return (
    <section className="max-w-xl space-y-6">
      <div>
        <h1 className="text-2xl font-semibold">Your profile</h1>
        <p className="text-sm text-slate-600">
          {profile.email} · {profile.siteRole === "admin" ? "site admin" : "member"} since{" "}
          {new Date(profile.createdAt).toLocaleDateString()}
        </p>
      </div>
      <div className="rounded-lg border border-slate-200 bg-white p-5">
        <DisplayNameForm profile={profile} />
      </div>
      <div className="rounded-lg border border-slate-200 bg-white p-5">
        <h2 className="mb-4 text-lg font-semibold">Password</h2>
        <PasswordForm />
      </div>
      <div className="rounded-lg border border-slate-200 bg-white p-5">
        <h2 className="mb-4 text-lg font-semibold">Notifications</h2>
        <NotificationSettings />
      </div>
      <div className="rounded-lg border border-slate-200 bg-white p-5">
        <h2 className="mb-4 text-lg font-semibold">Access tokens</h2>
        <AccessTokens projects={projects.data ?? []} />
      </div>
    </section>
  );
}

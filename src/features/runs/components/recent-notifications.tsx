// The signed-in front page's "waiting for you": unread notifications (decisions, items to review, mentions, runs
// that ended) with their links, read here without opening the bell. Marking them read stays the bell's job.
import { Link } from "react-router-dom";
import { plural } from "@/lib/plural";
import { useNotifications } from "../api/list-notifications";

const SHOWN = 5;

export function RecentNotifications() {
  const { data } = useNotifications(true);
  if (!data) return null;
  const unread = data.items.filter((n) => !n.readAt);
  return (
    <section className="space-y-2" data-testid="recent-notifications">
      <h2 className="text-sm font-semibold text-slate-900">Waiting for you</h2>
      {unread.length === 0 ? (
        <p className="text-sm text-slate-600">Nothing new since you last looked.</p>
      ) : (
        <>
          <p className="text-sm text-slate-600">{plural(data.unreadCount, "unread notification")}.</p>
          <ul className="divide-y divide-slate-100 rounded-lg border border-slate-200 bg-white">
            {unread.slice(0, SHOWN).map((n) => (
              <li key={n.id} className="px-4 py-2 text-sm">
                {n.link ? (
                  <Link to={n.link} className="font-medium text-brand-700 hover:underline">
                    {n.title}
                  </Link>
                ) : (
                  <span className="font-medium text-slate-900">{n.title}</span>
                )}
                {n.body && <p className="text-xs text-slate-600">{n.body}</p>}
              </li>
            ))}
          </ul>
        </>
      )}
    </section>
  );
}

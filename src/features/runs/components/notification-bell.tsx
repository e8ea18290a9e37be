// The header's bell: unread count, and a panel listing recent notifications; opening it marks them read.
import { useEffect, useRef, useState } from "react";
import { Link } from "react-router-dom";
import { useNotifications } from "../api/list-notifications";
import { useMarkNotificationsRead } from "../api/mark-notifications-read";

export function NotificationBell({ signedIn }: { signedIn: boolean }) {
  const { data } = useNotifications(signedIn);
  const markRead = useMarkNotificationsRead();
  const [isOpen, setOpen] = useState(false);
  const ref = useRef<HTMLDivElement>(null);

  useEffect(() => {
    if (!isOpen) return;
    const close = (e: MouseEvent) => {
      if (!ref.current?.contains(e.target as Node)) setOpen(false);
    };
    document.addEventListener("mousedown", close);
    return () => document.removeEventListener("mousedown", close);
  }, [isOpen]);

  if (!signedIn || !data) return null;
  const unread = data.unreadCount;
  const toggle = () => {
    setOpen((o) => !o);
    if (!isOpen && unread > 0) markRead.mutate({ all: true });
  };
  return (
    <div className="relative" ref={ref}>
      <button
        type="button"
        onClick={toggle}
        aria-haspopup="dialog"
        aria-expanded={isOpen}
        aria-label={unread ? `Notifications, ${unread} unread` : "Notifications"}
        className="relative rounded-md p-2 text-slate-200 hover:bg-slate-800 hover:text-white"
        data-testid="notification-bell"
      >
        <svg
          viewBox="0 0 24 24"
          className="h-5 w-5"
          fill="none"
          stroke="currentColor"
          strokeWidth={1.8}
          aria-hidden="true"
        >
          <path d="M6 8a6 6 0 1 1 12 0c0 7 3 9 3 9H3s3-2 3-9" strokeLinecap="round" strokeLinejoin="round" />
          <path d="M10.3 21a1.94 1.94 0 0 0 3.4 0" strokeLinecap="round" />
        </svg>
        {unread > 0 && (
          <span
            className="absolute -right-0.5 -top-0.5 min-w-4 rounded-full bg-red-600 px-1 text-center text-[10px] font-semibold leading-4 text-white"
            data-testid="notification-count"
          >
            {unread > 99 ? "99+" : unread}
          </span>
        )}
      </button>
      {isOpen && (
        <div
          role="dialog"
          aria-label="Notifications"
          className="absolute right-0 z-30 mt-2 w-80 rounded-lg border border-slate-200 bg-white text-slate-900 shadow-lg"
        >
          <p className="border-b border-slate-100 px-4 py-2 text-sm font-semibold">Notifications</p>
          {data.items.length === 0 ? (
            <p className="px-4 py-3 text-sm text-slate-500">
              Nothing yet. Decisions on reductions you proposed, reductions waiting for your review, mentions with @,
              and runs that took longer than a minute appear here.
            </p>
          ) : (
            <ul className="max-h-96 divide-y divide-slate-100 overflow-y-auto">
              {data.items.map((n) => (
                <li key={n.id} className={`px-4 py-2 text-sm ${n.readAt ? "" : "bg-brand-50"}`}>
                  {n.link ? (
                    <Link
                      to={n.link}
                      className="font-medium text-brand-700 hover:underline"
                      onClick={() => setOpen(false)}
                    >
                      {n.title}
                    </Link>
                  ) : (
                    <span className="font-medium">{n.title}</span>
                  )}
                  <p className="text-slate-600">{n.body}</p>
                  <p className="text-xs text-slate-400">{new Date(n.createdAt).toLocaleString()}</p>
                </li>
              ))}
            </ul>
          )}
        </div>
      )}
    </div>
  );
}

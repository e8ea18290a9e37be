// The header's account corner: "Sign in" for visitors; for a signed-in person their name opens a menu with the
// profile and sign-out. Admins also get the Mailbox link while the local mail fake is in use.
import { useEffect, useRef, useState } from "react";
import { Link, NavLink } from "react-router-dom";
import { useSession } from "../api/get-session";
import { useSignOut } from "../api/sign-out";

const linkClass = ({ isActive }: { isActive: boolean }) =>
  `rounded-md px-3 py-2 text-sm font-medium ${isActive ? "bg-brand-700 text-white" : "text-slate-200 hover:bg-brand-800 hover:text-white"}`;

export function UserMenu() {
  const { data: session } = useSession();
  const signOut = useSignOut();
  const [isOpen, setOpen] = useState(false);
  const menuRef = useRef<HTMLDivElement>(null);

  useEffect(() => {
    if (!isOpen) return;
    const close = (e: MouseEvent) => {
      if (!menuRef.current?.contains(e.target as Node)) setOpen(false);
    };
    document.addEventListener("mousedown", close);
    return () => document.removeEventListener("mousedown", close);
  }, [isOpen]);

  if (!session) return null;
  if (!session.user) {
    return (
      <Link
        to="/sign-in"
        className="rounded-md bg-white px-3 py-1.5 text-sm font-medium text-slate-900 hover:bg-slate-100"
        data-testid="sign-in-link"
      >
        Sign in
      </Link>
    );
  }
  const user = session.user;
  return (
    <div className="flex items-center gap-2">
      {session.mailboxAvailable && (
        <NavLink to="/mailbox" className={linkClass} data-testid="mailbox-link">
          Mailbox
        </NavLink>
      )}
      <div className="relative" ref={menuRef}>
        <button
          type="button"
          aria-haspopup="menu"
          aria-expanded={isOpen}
          onClick={() => setOpen((o) => !o)}
          className="flex items-center gap-2 rounded-md px-3 py-1.5 text-sm font-medium text-white hover:bg-slate-800"
          data-testid="user-menu"
        >
          <span
            className="flex h-7 w-7 items-center justify-center rounded-full bg-brand-700 text-xs font-semibold uppercase"
            aria-hidden
          >
            {user.displayName.slice(0, 1)}
          </span>
          <span className="max-w-48 truncate">{user.displayName}</span>
          <span aria-hidden>▾</span>
        </button>
        {isOpen && (
          <div
            role="menu"
            className="absolute right-0 z-30 mt-2 w-56 rounded-md bg-white py-1 text-sm text-slate-800 shadow-lg ring-1 ring-slate-200"
          >
            <p className="truncate px-4 py-2 text-xs text-slate-500">
              {user.email}
              {user.siteRole === "admin" ? " · site admin" : ""}
            </p>
            <Link
              role="menuitem"
              to="/profile"
              className="block px-4 py-2 hover:bg-slate-100"
              onClick={() => setOpen(false)}
            >
              Profile
            </Link>
            <Link
              role="menuitem"
              to="/api-reference"
              className="block px-4 py-2 hover:bg-slate-100"
              onClick={() => setOpen(false)}
            >
              API reference
            </Link>
            <button
              role="menuitem"
              type="button"
              className="block w-full px-4 py-2 text-left hover:bg-slate-100"
              onClick={() => {
                setOpen(false);
                signOut.mutate();
              }}
            >
              Sign out
            </button>
          </div>
        )}
      </div>
    </div>
  );
}

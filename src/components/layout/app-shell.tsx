// The frame every screen sits in: a skip link (the first thing Tab reaches), header with product name, navigation,
// the account slot, and the footer status. It knows no feature: the router fills the slots.
import { useState, type ReactNode } from "react";
import { NavLink, Outlet } from "react-router-dom";

export interface NavItem {
  to: string;
  label: string;
}

const navItems: NavItem[] = [
  { to: "/", label: "Overview" },
  { to: "/automata", label: "Automata" },
  { to: "/projects", label: "Projects" },
];

function navClass({ isActive }: { isActive: boolean }) {
  return `rounded-md px-3 py-2 text-sm font-medium ${isActive ? "bg-brand-700 text-white" : "text-slate-200 hover:bg-brand-800 hover:text-white"}`;
}

export interface AppShellProps {
  accountSlot?: ReactNode;
  notificationSlot?: ReactNode;
  /** Shown at the right of the footer. */
  statusSlot?: ReactNode;
}

export function AppShell({ accountSlot, notificationSlot, statusSlot }: AppShellProps) {
  const [isMenuOpen, setMenuOpen] = useState(false);
  return (
    <div className="flex min-h-screen flex-col">
      <a
        href="#main"
        data-testid="skip-link"
        onClick={(e) => {
          // focus the content itself, so the next Tab continues from there rather than from the header
          e.preventDefault();
          document.getElementById("main")?.focus();
        }}
        className="sr-only z-50 rounded-md bg-white px-3 py-2 text-sm font-medium text-slate-900 shadow focus:not-sr-only focus:fixed focus:left-3 focus:top-3 focus:outline-2 focus:outline-amber-600"
      >
        Skip to content
      </a>
      <header className="bg-slate-900 text-white shadow">
        <div className="mx-auto flex max-w-7xl items-center gap-4 px-4 py-3">
          <NavLink
            to="/"
            className="flex items-center gap-2 text-lg font-semibold tracking-tight"
            data-testid="product-name"
          >
            <img src="/favicon.svg" alt="" className="h-7 w-7" />
            Emulant
          </NavLink>
          <button
            type="button"
            className="ml-auto rounded-md p-2 text-slate-200 hover:bg-slate-800 md:hidden"
            aria-label="Toggle navigation"
            aria-expanded={isMenuOpen}
            onClick={() => setMenuOpen((o) => !o)}
          >
            ☰
          </button>
          <nav
            aria-label="Main"
            className={`${isMenuOpen ? "flex" : "hidden"} absolute left-0 right-0 top-14 z-20 flex-col gap-1 bg-slate-900 p-3 md:static md:flex md:flex-row md:p-0`}
          >
            {navItems.map((item) => (
              <NavLink
                key={item.to}
                to={item.to}
                end={item.to === "/"}
                className={navClass}
                onClick={() => setMenuOpen(false)}
              >
                {item.label}
              </NavLink>
            ))}
          </nav>
          <div className="flex items-center gap-2 md:ml-auto">
            {notificationSlot}
            {accountSlot}
          </div>
        </div>
      </header>
      <main id="main" tabIndex={-1} className="mx-auto w-full max-w-7xl flex-1 px-4 py-6 focus:outline-none">
        <Outlet />
      </main>
      <footer className="border-t border-slate-200 bg-white">
        <div className="mx-auto flex max-w-7xl flex-wrap items-center justify-between gap-2 px-4 py-3 text-xs text-slate-500">
          <span>
            Reductions are statements about models, not about cells. Models are research aids, not clinical or safety
            advice.
          </span>
          {statusSlot}
        </div>
      </footer>
    </div>
  );
}

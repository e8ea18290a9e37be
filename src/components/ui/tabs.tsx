// A row of tab links under a page title; the active tab follows the URL.
import { NavLink } from "react-router-dom";

export interface TabLink {
  to: string;
  label: string;
  end?: boolean;
}

export function TabBar({ tabs, label }: { tabs: readonly TabLink[]; label: string }) {
  return (
    <nav aria-label={label} className="flex gap-1 overflow-x-auto border-b border-slate-200">
      {tabs.map((tab) => (
        <NavLink
          key={tab.to}
          to={tab.to}
          end={tab.end}
          className={({ isActive }) =>
            `-mb-px whitespace-nowrap border-b-2 px-4 py-2 text-sm font-medium ${isActive ? "border-brand-700 text-brand-700" : "border-transparent text-slate-600 hover:border-slate-300 hover:text-slate-900"}`
          }
        >
          {tab.label}
        </NavLink>
      ))}
    </nav>
  );
}

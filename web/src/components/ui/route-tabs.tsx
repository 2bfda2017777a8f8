import { NavLink } from 'react-router';

export type RouteTab = { to: string; label: string; end?: boolean };

/** Tabs that are links, so each tab has its own address and the back button works. */
export function RouteTabs({ label, tabs }: { label: string; tabs: readonly RouteTab[] }) {
  return (
    <nav aria-label={label} className="border-b border-rule">
      <ul className="flex flex-wrap gap-1">
        {tabs.map((tab) => (
          <li key={tab.to}>
            <NavLink
              to={tab.to}
              end={tab.end}
              className={({ isActive }) =>
                `-mb-px inline-block border-b-4 px-3 py-1.5 text-sm font-medium ${
                  isActive ? 'border-b-twin font-bold' : 'border-b-transparent hover:border-b-rule'
                }`
              }
            >
              {tab.label}
            </NavLink>
          </li>
        ))}
      </ul>
    </nav>
  );
}

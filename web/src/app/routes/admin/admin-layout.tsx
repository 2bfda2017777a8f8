import { NavLink, Outlet } from 'react-router';

const ADMIN_PAGES = [
  { to: '/admin/users', label: 'Users and roles' },
  { to: '/admin/access-tokens', label: 'Access tokens' },
  { to: '/admin/dev-mail', label: 'Development mailbox' },
  { to: '/admin/audit', label: 'Audit log' },
] as const;

export function AdminLayout() {
  return (
    <div className="space-y-4">
      <nav aria-label="Admin" className="border-b border-rule">
        <ul className="flex flex-wrap gap-1">
          {ADMIN_PAGES.map((page) => (
            <li key={page.to}>
              <NavLink
                to={page.to}
                className={({ isActive }) =>
                  `-mb-px inline-block border-b-4 px-3 py-1.5 text-sm font-medium ${
                    isActive ? 'border-b-twin font-bold' : 'border-b-transparent hover:border-b-rule'
                  }`
                }
              >
                {page.label}
              </NavLink>
            </li>
          ))}
        </ul>
      </nav>
      <Outlet />
    </div>
  );
}

import { NavLink } from 'react-router';
import { SECTIONS } from '../../config/sections';
import { hasRole, type SignedInUser } from '../../features/session/roles';
import { SectionIcon } from '../ui/section-icons';

export function MainNav({ user }: { user: SignedInUser }) {
  const visibleSections = SECTIONS.filter((section) => hasRole(user, section.requiredRole));
  return (
    <nav aria-label="Main" className="border-r border-rule bg-panel py-3">
      <ul className="space-y-0.5">
        {visibleSections.map((section) => (
          <li key={section.key}>
            <NavLink
              to={section.path}
              end={section.path === '/'}
              title={section.label}
              className={({ isActive }) =>
                `flex items-center gap-2.5 border-l-4 px-3 py-2 text-sm font-medium hover:bg-paper ${
                  isActive ? 'border-l-twin bg-paper font-bold' : 'border-l-transparent'
                }`
              }
            >
              <SectionIcon section={section.key} />
              <span className="sr-only md:not-sr-only">{section.label}</span>
            </NavLink>
          </li>
        ))}
      </ul>
    </nav>
  );
}

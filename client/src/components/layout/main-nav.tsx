import { NavLink } from 'react-router-dom';
import { navItemsFor, type Feature } from '../../config/nav';
import type { Role } from '@contract';

interface MainNavProps {
  role: Role;
  features: ReadonlySet<Feature>;
  id?: string;
  className?: string;
  onNavigate?: () => void;
}

const linkClass = ({ isActive }: { isActive: boolean }) =>
  `flex min-h-touch items-center rounded-md px-3 text-base font-semibold ${
    isActive ? 'bg-ink-700 text-white' : 'text-ink-100 hover:bg-ink-800 hover:text-white'
  }`;

/** Shows only the areas the role may use (config/nav.ts is the one list). */
export function MainNav({ role, features, id, className = '', onNavigate }: MainNavProps) {
  return (
    <nav aria-label="Main" id={id} className={className}>
      <ul className="flex flex-col gap-1 md:flex-row md:items-center">
        {navItemsFor(role, features).map((item) => (
          <li key={item.id}>
            <NavLink to={item.to} className={linkClass} onClick={onNavigate}>
              {item.label}
            </NavLink>
          </li>
        ))}
      </ul>
    </nav>
  );
}

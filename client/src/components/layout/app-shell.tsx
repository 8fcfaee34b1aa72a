import { useState, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import type { Feature } from '../../config/nav';
import { paths } from '../../config/paths';
import type { Role } from '@contract';
import { roleLabels } from '../../config/roles';
import { Button } from '../ui/button';
import { MainNav } from './main-nav';
import { Wordmark } from './wordmark';

interface AppShellProps {
  user: { name: string; role: Role };
  companyName: string;
  features: ReadonlySet<Feature>;
  onSignOut: () => void;
  signingOut: boolean;
  children: ReactNode;
}

export function AppShell({ user, companyName, features, onSignOut, signingOut, children }: AppShellProps) {
  const [menuOpen, setMenuOpen] = useState(false);
  return (
    <div className="min-h-dvh bg-paper">
      <a
        href="#main"
        className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:bg-white focus:p-3"
      >
        Skip to content
      </a>
      <header
        className="bg-ink-900 text-white"
        onKeyDown={(e) => {
          if (e.key === 'Escape') setMenuOpen(false);
        }}
      >
        <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-x-4 gap-y-2 px-4 py-2">
          {/* Phone: mark + buttons, then who is signed in, then the opened menu. Desktop: one row. */}
          <Link
            to={paths.home}
            className="order-1 flex min-h-touch items-center rounded-md"
            aria-label="Gaugeline, start page"
          >
            <Wordmark inverse />
          </Link>
          <MainNav
            id="main-nav"
            role={user.role}
            features={features}
            onNavigate={() => setMenuOpen(false)}
            className={`order-4 w-full pb-2 md:order-2 md:block md:w-auto md:pb-0 ${menuOpen ? 'block' : 'hidden'}`}
          />
          <p className="order-3 w-full border-t border-ink-700 pt-1 leading-tight md:order-3 md:ml-auto md:w-auto md:border-0 md:pt-0 md:text-right">
            <span data-testid="user-name" className="font-semibold md:block">
              {user.name}
            </span>
            <span className="text-sm text-ink-200 md:block">
              <span className="md:hidden"> · </span>
              {roleLabels[user.role]} · {companyName}
            </span>
          </p>
          <div className="order-2 ml-auto flex items-center gap-2 md:order-4 md:ml-0">
            <Button variant="ghost" className="text-white hover:bg-ink-800" busy={signingOut} onClick={onSignOut}>
              Sign out
            </Button>
            <button
              type="button"
              className="inline-flex min-h-touch min-w-touch items-center justify-center rounded-md hover:bg-ink-800 md:hidden"
              aria-expanded={menuOpen}
              aria-controls="main-nav"
              onClick={() => setMenuOpen((o) => !o)}
            >
              <span className="sr-only">Menu</span>
              <svg aria-hidden="true" viewBox="0 0 24 24" className="size-6">
                <path
                  d={menuOpen ? 'M6 6l12 12M18 6 6 18' : 'M4 7h16M4 12h16M4 17h16'}
                  stroke="currentColor"
                  strokeWidth="2"
                  strokeLinecap="round"
                />
              </svg>
            </button>
          </div>
        </div>
      </header>
      <main id="main" className="mx-auto max-w-7xl px-4 py-6 sm:py-8">
        {children}
      </main>
    </div>
  );
}

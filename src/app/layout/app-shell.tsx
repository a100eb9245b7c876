import type { ReactNode } from 'react';
import { Link, NavLink, Outlet } from 'react-router-dom';
import { LogoMark } from '../../components/ui/logo-mark';
import { HealthBadge } from '../../features/health/components/health-badge';

export type NavItem = { to: string; label: string };

const navItems: NavItem[] = [
  { to: '/', label: 'Home' },
  { to: '/compare', label: 'Compare' },
  { to: '/studies/demo', label: 'Reference study' },
];

export function AppShell({ extraNav = [], account }: { extraNav?: NavItem[]; account?: ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:bg-paper-raised focus:p-2">
        Skip to content
      </a>
      <header className="border-b border-rule bg-paper-raised">
        <div className="mx-auto flex max-w-[1600px] items-center gap-6 px-4 py-2">
          <Link to="/" className="flex items-center gap-2 font-semibold tracking-tight" aria-label="Dwellform home">
            <LogoMark />
            <span className="text-lg">Dwellform</span>
          </Link>
          <nav aria-label="Main" className="flex gap-1 text-sm">
            {[...navItems, ...extraNav].map((item) => (
              <NavLink
                key={item.to}
                to={item.to}
                end={item.to === '/'}
                className={({ isActive }) =>
                  `rounded px-2 py-1 ${isActive ? 'bg-ink text-paper' : 'text-ink-soft hover:bg-rule/50'}`
                }
              >
                {item.label}
              </NavLink>
            ))}
          </nav>
          <div className="ml-auto flex items-center gap-4">
            <HealthBadge />
            {account}
          </div>
        </div>
      </header>
      <main id="main" className="flex-1">
        <Outlet />
      </main>
      <footer className="border-t border-rule px-4 py-2 text-xs text-ink-faint">
        Predictions support, and never replace, part qualification, process specifications, local codes and licensed
        engineering practice.
      </footer>
    </div>
  );
}

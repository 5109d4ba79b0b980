import type { ReactNode } from 'react';
import { Link, NavLink } from 'react-router-dom';
import { BrandMark } from './brand-mark';
import { SiteFooter } from './site-footer';

export interface NavItem {
  to: string;
  label: string;
}

interface AppShellProps {
  nav: NavItem[];
  /** The signed-in person's corner (name, role, sign-out), or a sign-in link. */
  account: ReactNode;
  children: ReactNode;
}

const navLinkClass = ({ isActive }: { isActive: boolean }) =>
  `-mb-px inline-flex items-center border-b-[3px] px-3 py-2.5 text-small font-semibold ${
    isActive ? 'border-ember-500 text-ink' : 'border-transparent text-ink-soft hover:border-paper-line hover:text-ink'
  }`;

export function AppShell({ nav, account, children }: AppShellProps) {
  return (
    <div className="flex min-h-screen flex-col">
      <a
        href="#main"
        className="sr-only focus:not-sr-only focus:absolute focus:left-4 focus:top-4 focus:z-50 focus:rounded-plate focus:bg-paper-raised focus:px-4 focus:py-2 focus:text-tide-800"
      >
        Skip to content
      </a>
      <div className="h-1.5 bg-gradient-to-r from-tide-700 via-tide-500 to-ember-500" aria-hidden="true" />
      <header className="border-b border-paper-line bg-paper-raised">
        <div className="mx-auto flex max-w-sheet flex-wrap items-center justify-between gap-x-8 gap-y-3 px-5 pt-3 sm:px-8">
          <Link to="/" className="flex items-center gap-2 text-tide-800" aria-label="Stillspan, home">
            <BrandMark />
            <span className="text-lead font-bold tracking-[-0.02em]">Stillspan</span>
          </Link>
          <div className="flex min-w-0 max-w-full items-center gap-3">{account}</div>
        </div>
        <div className="mx-auto max-w-sheet px-2 sm:px-5">
          <nav aria-label="Main" className="flex flex-wrap items-center gap-1 pt-1">
            {nav.map((item) => (
              <NavLink key={item.to} to={item.to} className={navLinkClass}>
                {item.label}
              </NavLink>
            ))}
          </nav>
        </div>
      </header>
      <main id="main" className="mx-auto w-full max-w-sheet flex-1 px-5 py-8 sm:px-8 sm:py-10">
        {children}
      </main>
      <SiteFooter />
    </div>
  );
}

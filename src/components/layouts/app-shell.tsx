import type { ReactNode } from 'react';
import { NavLink } from 'react-router-dom';
import { Button } from '../ui/button';
import { Wordmark } from '../ui/logo-mark';

export interface NavItem {
  /** Stable key for tests: rendered as data-nav. */
  key: string;
  label: string;
  href: string;
  /** Match the whole path only (the fleet overview at "/"). */
  end?: boolean;
}

export interface NavGroup {
  label: string;
  items: NavItem[];
}

interface AppShellProps {
  nav: NavGroup[];
  userName: string;
  userDetail: string;
  onSignOut: () => void;
  signingOut: boolean;
  children: ReactNode;
}

export const ADVISORY_NOTICE =
  "Kilowatch advises; the vessel's power management system, the maker's limits, class rules, local regulations and the chief engineer decide.";

/** The signed-in frame: console bar with the member's navigation, the page, and the advisory footer. */
export function AppShell({ nav, userName, userDetail, onSignOut, signingOut, children }: AppShellProps) {
  return (
    <div className="flex min-h-screen flex-col">
      <header className="border-b-4 border-brass-400 bg-hull-900 text-hull-100">
        <div className="mx-auto flex max-w-sheet flex-wrap items-center justify-between gap-4 px-gutter py-3">
          <Wordmark tone="light" />
          <div className="flex items-center gap-3 text-small">
            <span className="text-right leading-tight">
              <span className="block font-semibold text-hull-50" data-user-name>
                {userName}
              </span>
              <span className="block text-caption text-hull-300">{userDetail}</span>
            </span>
            <Button variant="secondary" size="sm" onClick={onSignOut} pending={signingOut} pendingLabel="Signing out…" data-action="sign-out">
              Sign out
            </Button>
          </div>
        </div>
        <nav aria-label="Main" className="mx-auto flex max-w-sheet flex-wrap gap-x-6 gap-y-1 px-gutter pb-2">
          {nav.map((group) => (
            <div key={group.label} className="flex flex-wrap items-center gap-1">
              <span className="mr-1 text-caption uppercase text-hull-400">{group.label}</span>
              {group.items.map((item) => (
                <NavLink
                  key={item.key}
                  to={item.href}
                  end={item.end}
                  data-nav={item.key}
                  className={({ isActive }) =>
                    `rounded-plate px-2.5 py-1 text-small font-semibold ${isActive ? 'bg-brass-400 text-hull-950' : 'text-hull-100 hover:bg-hull-800'}`
                  }
                >
                  {item.label}
                </NavLink>
              ))}
            </div>
          ))}
        </nav>
      </header>
      <main className="mx-auto w-full max-w-sheet flex-1 px-gutter py-8">{children}</main>
      <footer className="border-t border-deck-200 bg-deck-100">
        <p className="mx-auto max-w-sheet px-gutter py-4 text-caption text-hull-600" data-advisory-notice>
          {ADVISORY_NOTICE}
        </p>
      </footer>
    </div>
  );
}

import { useEffect, useRef, useState } from "react";
import { Link, Outlet, useLocation, useMatches } from "react-router";
import { AppNav } from "./app-nav";
import { CompanySwitcher } from "./company-switcher";
import { ContrastToggle } from "./contrast-toggle";
import { navItems } from "./nav-items";
import { useSignedIn } from "./session-context";
import { SignOutButton } from "./sign-out-button";
import { SkipLink } from "./skip-link";

export function AppShell() {
  const { session, user, membership } = useSignedIn();
  const { pathname } = useLocation();
  const main = useRef<HTMLElement>(null);
  const first = useRef(true);
  // On a phone the header is one row; the navigation and the account controls open from "Menu".
  const [menuOpen, setMenuOpen] = useState(false);
  // A route whose module exports `handle = { fullScreen: true }` (the Walk screen) gets the whole
  // screen: no header or navigation around it, for the eye or a screen reader.
  const fullScreen = useMatches().some((m) => (m.handle as { fullScreen?: boolean } | undefined)?.fullScreen);

  // After a client-side page change, start reading at the new page, as a full load would, and fold the menu.
  useEffect(() => {
    setMenuOpen(false);
    if (first.current) {
      first.current = false;
      return;
    }
    main.current?.focus();
  }, [pathname]);

  if (fullScreen) {
    return (
      <main id="main" ref={main} tabIndex={-1} className="outline-none">
        <Outlet />
      </main>
    );
  }
  const folded = menuOpen ? "" : "max-sm:hidden";
  return (
    <div className="min-h-dvh">
      <SkipLink />
      <header className="bg-surface edge border-x-0 border-t-0">
        <div className="mx-auto flex max-w-6xl flex-wrap items-center justify-between gap-x-3 gap-y-2 px-4 py-2 sm:py-3">
          <div className="flex min-w-0 items-center gap-4">
            <Link to="/" className="text-2xl font-bold no-underline">
              Plumeline
            </Link>
            <div className={folded}>
              <CompanySwitcher memberships={session.memberships} active={membership} />
            </div>
          </div>
          <button
            type="button"
            className="inline-flex min-h-11 items-center rounded-md px-3 font-bold text-accent hover:bg-accent-soft sm:hidden"
            aria-expanded={menuOpen}
            aria-controls="app-menu"
            onClick={() => setMenuOpen((open) => !open)}
          >
            {menuOpen ? "Close menu" : "Menu"}
          </button>
          <div id="app-menu" className={`flex flex-wrap items-center gap-2 max-sm:w-full ${folded}`}>
            <Link
              to="/profile"
              className="inline-flex min-h-11 items-center rounded-md px-3 font-bold hover:bg-accent-soft"
              aria-label={`Profile of ${user.name}`}
            >
              {user.name}
            </Link>
            <ContrastToggle />
            <SignOutButton />
          </div>
        </div>
        <div className={`mx-auto max-w-6xl px-4 pb-3 ${folded}`}>
          <AppNav items={navItems(membership.role, session)} />
        </div>
      </header>
      {/* The layout editor uses the whole width of the screen; every other page keeps a readable measure. */}
      <main
        id="main"
        ref={main}
        tabIndex={-1}
        className={`mx-auto px-4 py-6 outline-none ${pathname.endsWith("/layout") ? "max-w-none" : "max-w-6xl"}`}
      >
        <Outlet />
      </main>
    </div>
  );
}

import { Outlet } from "react-router";
import { ContrastToggle } from "./contrast-toggle";
import { SkipLink } from "./skip-link";

/** Sign-in, password reset and invitation pages: no navigation, just the task. */
export function PublicLayout() {
  return (
    <div className="min-h-dvh">
      <SkipLink />
      <header className="mx-auto flex max-w-xl items-center justify-between gap-3 px-4 pt-6">
        <p className="text-2xl font-bold text-accent">Plumeline</p>
        <ContrastToggle />
      </header>
      <main id="main" tabIndex={-1} className="mx-auto max-w-xl px-4 py-6 outline-none">
        <Outlet />
      </main>
    </div>
  );
}

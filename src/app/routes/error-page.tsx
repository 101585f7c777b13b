import { isRouteErrorResponse, useRouteError } from "react-router";
import { Component as NotFound } from "./not-found";

/**
 * The page for anything that breaks while rendering or loading a route. It explains in words
 * and offers a way on; the error itself goes to the console for developers, never on screen.
 */
export function ErrorPage() {
  const error = useRouteError();
  if (isRouteErrorResponse(error) && error.status === 404) return <NotFound />;
  console.error(error);
  return <ErrorMessage />;
}

/** Outside the app shell there is no <main> yet, so this one brings its own. */
export function RootErrorPage() {
  const error = useRouteError();
  if (isRouteErrorResponse(error) && error.status === 404) {
    return (
      <main id="main" className="mx-auto max-w-xl px-4 py-10">
        <NotFound />
      </main>
    );
  }
  console.error(error);
  return (
    <main id="main" className="mx-auto max-w-xl px-4 py-10">
      <ErrorMessage />
    </main>
  );
}

function ErrorMessage() {
  return (
    <section className="space-y-4 py-6">
      <h1 className="text-3xl font-bold">Something went wrong</h1>
      <p>
        This page could not be shown. Reloading usually helps; if it keeps happening, tell your Plumeline administrator
        what you were doing.
      </p>
      <div className="flex flex-wrap gap-3">
        <button
          type="button"
          onClick={() => window.location.reload()}
          className="inline-flex min-h-11 items-center rounded-md bg-accent px-4 font-bold text-on-accent"
        >
          Reload the page
        </button>
        <a href="/" className="inline-flex min-h-11 items-center">
          Go to the stores
        </a>
      </div>
    </section>
  );
}

import { QueryClientProvider } from "@tanstack/react-query";
import { render } from "@testing-library/react";
import type { ReactElement } from "react";
import { createMemoryRouter, RouterProvider, type RouteObject } from "react-router";
import { routes } from "../../src/app/router";
import { createAppQueryClient } from "../../src/app/app-query-client";

function testQueryClient() {
  const client = createAppQueryClient();
  client.setDefaultOptions({ queries: { retry: false, staleTime: Infinity }, mutations: { retry: false } });
  return client;
}

/** One component on a route of its own, with a marker page for wherever it navigates to. */
export function renderOnRoute(element: ReactElement, { path = "/", url = path }: { path?: string; url?: string } = {}) {
  const queryClient = testQueryClient();
  const testRoutes: RouteObject[] = [
    { path, element },
    { path: "*", element: <p data-testid="elsewhere">elsewhere</p> },
  ];
  const router = createMemoryRouter(testRoutes, { initialEntries: [url] });
  const view = render(
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
    </QueryClientProvider>,
  );
  return { ...view, router, queryClient };
}

/** The whole app's routes, as the browser gets them, starting at `url`. */
export function renderApp(url: string) {
  const queryClient = testQueryClient();
  const router = createMemoryRouter(routes, { initialEntries: [url] });
  const view = render(
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
    </QueryClientProvider>,
  );
  return { ...view, router, queryClient };
}

import { createBrowserRouter, type RouteObject } from "react-router";
import { ErrorPage, RootErrorPage } from "./routes/error-page";
import { Component as NotFound } from "./routes/not-found";
import { Spinner } from "../components/ui/spinner";
import { RequireSession } from "./shell/require-session";
import { PublicLayout } from "./shell/public-layout";

// Each page is a route module loaded on first visit, so the sign-in page stays small on a phone.
export const routes: RouteObject[] = [
  {
    ErrorBoundary: RootErrorPage,
    // Shown while the first page's module loads.
    HydrateFallback: () => <Spinner label="Opening Plumeline…" />,
    children: [
      {
        Component: PublicLayout,
        children: [
          { path: "/sign-in", lazy: () => import("./routes/sign-in") },
          { path: "/forgot-password", lazy: () => import("./routes/forgot-password") },
          { path: "/reset-password/:token", lazy: () => import("./routes/reset-password") },
          { path: "/invite/:token", lazy: () => import("./routes/invite") },
          { path: "/sign-up", lazy: () => import("./routes/sign-up") },
          { path: "/sign-up/confirm/:token", lazy: () => import("./routes/sign-up-confirm") },
        ],
      },
      {
        Component: RequireSession,
        children: [
          {
            // Errors inside a page keep the header and navigation on screen.
            ErrorBoundary: ErrorPage,
            children: [
              { index: true, lazy: () => import("./routes/home") },
              { path: "/stores", lazy: () => import("./routes/home") },
              { path: "/today", lazy: () => import("./routes/today") },
              { path: "/systems/:systemId", lazy: () => import("./routes/system-records") },
              { path: "/findings/:findingId", lazy: () => import("./routes/finding") },
              { path: "/stores/:storeId", lazy: () => import("./routes/store") },
              { path: "/stores/:storeId/plans/:planId/layout", lazy: () => import("./routes/layout-editor") },
              { path: "/team", lazy: () => import("./routes/team") },
              { path: "/settings", lazy: () => import("./routes/company-settings") },
              { path: "/profile", lazy: () => import("./routes/profile") },
              { path: "/outbox", lazy: () => import("./routes/outbox") },
              { path: "/outbox/:messageId", lazy: () => import("./routes/outbox") },
              { path: "/stores/:storeId/sweeps", lazy: () => import("./routes/store-sweeps") },
              { path: "/stores/:storeId/sweeps/:sweepId/map", lazy: () => import("./routes/sweep-map") },
              { path: "/stores/:storeId/compare", lazy: () => import("./routes/compare") },
              { path: "/walk", lazy: () => import("./routes/walk-start") },
              { path: "/stores/:storeId/walk", lazy: () => import("./routes/walk-start") },
              { path: "/stores/:storeId/walk/:sweepId", lazy: () => import("./routes/walk") },
              { path: "/detectors", lazy: () => import("./routes/detectors") },
              { path: "/help", lazy: () => import("./routes/help") },
              { path: "/welcome", lazy: () => import("./routes/welcome") },
              { path: "/help/:topic", lazy: () => import("./routes/help") },
              { path: "*", Component: NotFound },
            ],
          },
        ],
      },
    ],
  },
];

export function createAppRouter() {
  return createBrowserRouter(routes);
}

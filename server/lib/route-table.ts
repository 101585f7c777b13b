import type { Express } from "express";
import type { z } from "zod";
import type { Permission } from "#core/domain/roles";

/** One API route as the routers declare it, read from the tags `validate` and `requireMember` leave. */
export interface RouteEntry {
  method: "get" | "post" | "put" | "patch" | "delete";
  /** Express path, e.g. "/api/sweeps/:id/readings". */
  path: string;
  requires: { user?: boolean; member?: boolean; permission?: Permission };
  body?: z.ZodType;
  query?: z.ZodType;
  params?: z.ZodType;
}

interface Layer {
  route?: { path: string; methods: Record<string, boolean>; stack: Array<{ handle: Tagged }> };
  handle: Tagged & { stack?: Layer[] };
  matchers?: unknown[];
  path?: string;
}
type Tagged = {
  validates?: { part: "body" | "query" | "params"; schema: z.ZodType };
  requires?: RouteEntry["requires"];
};

/** Every route under /api, with what it reads and who may call it; a new route is listed without anyone adding it. */
export function routeTable(app: Express, apiPrefix = "/api"): RouteEntry[] {
  const out: RouteEntry[] = [];
  const root = (app as unknown as { router: { stack: Layer[] } }).router.stack;
  // The /api router is the one whose routers hold the session route (probes live outside it).
  const holds = (stack: Layer[]): boolean =>
    stack.some((s) => s.route?.path === "/auth/session" || (s.handle.stack !== undefined && holds(s.handle.stack)));
  const api = root.find((l) => l.handle.stack && holds(l.handle.stack));
  if (!api) throw new Error("the /api router was not found");
  const visit = (stack: Layer[]) => {
    for (const layer of stack) {
      if (layer.route) {
        const handlers = layer.route.stack.map((s) => s.handle);
        const requires = Object.assign({}, ...handlers.map((h) => h.requires ?? {}));
        const parts: Partial<Record<"body" | "query" | "params", z.ZodType>> = {};
        for (const h of handlers) if (h.validates) parts[h.validates.part] = h.validates.schema;
        for (const method of Object.keys(layer.route.methods).filter((m) => m !== "_all"))
          out.push({
            method: method as RouteEntry["method"],
            path: `${apiPrefix}${layer.route.path}`,
            requires,
            ...parts,
          });
      } else if (layer.handle.stack) visit(layer.handle.stack);
    }
  };
  visit(api.handle.stack!);
  return out;
}

import { afterAll, beforeAll, describe, expect, it } from "vitest";
import fc from "fast-check";
import type { z } from "zod";
import { agentFor, createTestApp, type Agent, type TestApp } from "../helpers/test-app";
import { companyFixture, fillPath, type CompanyFixture, type StoreIds } from "../helpers/security-fixtures";
import { contractArbitrary } from "../helpers/schema-arbitrary";
import { routeTable, type RouteEntry } from "../../server/lib/route-table";
import { can, ROLES } from "#core/domain/roles";

// Every route the routers declare × every role × (own company, another company's ids, a store contact
// with another store's ids, nobody signed in). Refused: 401 / 403 / 404 as due. Allowed: never 401/403.
// And no answer to company A ever carries an id or a name of company B.

let t: TestApp;
let a: CompanyFixture;
let b: CompanyFixture;
let anonymous: Agent;

beforeAll(async () => {
  t = await createTestApp();
  a = await companyFixture(t, "Kestrel Foods");
  b = await companyFixture(t, "Thistle Market");
  anonymous = await agentFor(t.app);
}, 120_000);
afterAll(() => t.close());

/** A body the route's own contract accepts (so a refusal is about the ids, not the body), else {}. */
function validBody(schema: z.ZodType | undefined): unknown {
  if (!schema) return {};
  for (const v of fc.sample(contractArbitrary(schema), { numRuns: 300, seed: 11 }))
    if (schema.safeParse(v).success) return v;
  return {};
}

function send(agent: Agent, r: RouteEntry, url: string, body: unknown) {
  const req = agent.agent[r.method](url);
  return r.method === "get" ? req : req.set("X-CSRF-Token", agent.csrf).send(body as object);
}

const hasIds = (r: RouteEntry) => r.path.includes("/:");
// Reads first, then writes, deletes, and removing members last (it signs a member out of the company).
const rank = (r: RouteEntry) =>
  r.method === "get" ? 0 : r.path.startsWith("/api/team/members") ? 3 : r.method === "delete" ? 2 : 1;

describe("the access matrix, read from the routers", () => {
  it("refuses and allows as the roles say, and never shows another company's data", { timeout: 600_000 }, async () => {
    const routes = routeTable(t.app)
      .filter((r) => r.requires.user)
      .sort((x, y) => rank(x) - rank(y));
    expect(routes.length).toBeGreaterThan(70);
    const failures: string[] = [];
    let requests = 0;
    const check = (ok: boolean, what: string) => {
      requests++;
      if (!ok) failures.push(what);
    };
    // Text answers as text, binary ones (PDF, images) as bytes read as latin1.
    const bodyText = (res: { text?: string; body?: unknown }) =>
      res.text ?? (Buffer.isBuffer(res.body) ? res.body.toString("latin1") : JSON.stringify(res.body ?? ""));
    const leaks = (res: { text?: string; body?: unknown }) => b.secrets.filter((s) => bodyText(res).includes(s));

    for (const r of routes) {
      const name = `${r.method.toUpperCase()} ${r.path}`;
      const res = await send(anonymous, r, fillPath(r.path, a, a.main), {});
      check(res.status === 401, `${name} anonymous → ${res.status}`);

      for (const role of ROLES) {
        const agent = a.agents[role];
        const permitted = !r.requires.permission || can(role, r.requires.permission);
        const own = (ids: StoreIds) => fillPath(r.path, a, ids);
        if (!permitted) {
          const refused = await send(agent, r, own(a.main), validBody(r.body));
          check(refused.status === 403, `${name} ${role} (no permission) → ${refused.status}`);
          continue;
        }
        if (hasIds(r)) {
          // Another company's ids: not found, never its data.
          const foreign = await send(agent, r, fillPath(r.path, b, b.main), validBody(r.body));
          const expected = r.method === "get" ? [404] : [400, 404];
          check(expected.includes(foreign.status), `${name} ${role} with another company's ids → ${foreign.status}`);
          check(leaks(foreign).length === 0, `${name} ${role} foreign answer leaks ${leaks(foreign)}`);
          // A store contact and another store of their own company.
          if (role === "store-contact" && r.path !== own(a.other)) {
            const other = await send(agent, r, own(a.other), validBody(r.body));
            check(expected.includes(other.status), `${name} store contact with another store's ids → ${other.status}`);
          }
        }
        const mine = await send(agent, r, own(a.main), r.method === "get" ? undefined : {});
        check(
          ![401, 403].includes(mine.status),
          `${name} ${role} (allowed) → ${mine.status} ${JSON.stringify(mine.body?.error ?? "")}`,
        );
        check(leaks(mine).length === 0, `${name} ${role} own answer leaks ${leaks(mine)}`);
      }
    }
    console.log(`access matrix: ${routes.length} routes, ${requests} checks, ${failures.length} failures`);
    if (failures.length) console.log(failures.join("\n"));
    expect(failures).toEqual([]);
  });
});

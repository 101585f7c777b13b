import { sql } from "drizzle-orm";
import type { AppContext } from "../../context";
import { bcryptHash } from "../../jobs/passwords";
import { companies, memberships, membershipStores, stores, users } from "../schema/index";
import type { Role } from "#core/domain/roles";
import { seedDemoLayout } from "./demo-store-map";
import { seedDemoSweeps } from "./demo-sweeps";
import { seedDemoCompliance } from "./demo-compliance";

// An invented grocery chain and its people. Everything here is demo data.
export const DEMO_SIGN_INS = {
  password: "plumeline-demo",
  people: [
    { role: "owner" as Role, name: "Dana Okafor", email: "dana@larkspur-market.example" },
    { role: "lead-tech" as Role, name: "Mateo Ruiz", email: "mateo@larkspur-market.example" },
    { role: "technician" as Role, name: "Priya Nair", email: "priya@larkspur-market.example" },
    { role: "engineer" as Role, name: "Jonas Weber", email: "jonas@larkspur-market.example" },
    { role: "store-contact" as Role, name: "Hannah Lee", email: "hannah@larkspur-market.example" },
  ],
};

/** Seeds the demo company once: does nothing when any company exists. Returns whether it seeded. */
export async function seedDemoIfEmpty(ctx: AppContext): Promise<boolean> {
  return ctx.db.transaction(async (tx) => {
    // Two `npm start`s racing on a fresh database must not both seed.
    await tx.execute(sql`select pg_advisory_xact_lock(4242001)`);
    const existing = await tx.select({ id: companies.id }).from(companies).limit(1);
    if (existing.length) return false;

    const [company] = await tx
      .insert(companies)
      .values({
        name: "Larkspur Market",
        lengthUnit: "ft-in",
        massUnit: "lb",
        ruleProfile: "us-federal",
        leakRateMethod: "annualizing",
      })
      .returning();
    const [store] = await tx
      .insert(stores)
      .values({
        companyId: company.id,
        name: "Larkspur Market – Cedar Hollow",
        address: "1180 Orchard Bend Road, Cedar Hollow",
        timeZone: "America/Chicago",
      })
      .returning();
    // On the CPU pool, as every password: at the production cost a hash is a quarter of a second of
    // CPU, which bcryptjs would spend on the event loop of a server that is already answering.
    const passwordHash = await bcryptHash(DEMO_SIGN_INS.password, ctx.config.bcryptCost);
    let leadTechId: string | null = null;
    const people = {} as Record<Role, string>;
    for (const person of DEMO_SIGN_INS.people) {
      const [user] = await tx
        .insert(users)
        .values({ email: person.email, name: person.name, passwordHash })
        .returning();
      const [m] = await tx
        .insert(memberships)
        .values({ companyId: company.id, userId: user.id, role: person.role })
        .returning();
      if (person.role === "store-contact")
        await tx.insert(membershipStores).values({ membershipId: m.id, storeId: store.id });
      if (person.role === "lead-tech") leadTechId = user.id;
      people[person.role] = user.id;
    }
    await seedDemoLayout(ctx, tx, { companyId: company.id, storeId: store.id, createdById: leadTechId });
    await seedDemoCompliance(tx, { companyId: company.id, storeId: store.id, timeZone: store.timeZone, people });
    await seedDemoSweeps(
      tx,
      {
        companyId: company.id,
        storeId: store.id,
        technicianId: people.technician,
        engineerId: people.engineer,
        now: new Date(),
      },
      store.timeZone,
    );
    return true;
  });
}

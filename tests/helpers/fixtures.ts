import bcrypt from "bcryptjs";
import type { AppContext } from "../../server/context";
import { companies, memberships, membershipStores, stores, users } from "../../server/db/schema/index";
import type { Role } from "#core/domain/roles";

export const PASSWORD = "correct horse battery";

/** A company with one member of each role and one store (the store contact's). Invented data. */
export async function seedCompany(ctx: Pick<AppContext, "db">, name: string) {
  const [company] = await ctx.db.insert(companies).values({ name }).returning();
  const [store] = await ctx.db
    .insert(stores)
    .values({ companyId: company.id, name: `${name} – Main Street`, timeZone: "America/New_York" })
    .returning();
  const [otherStore] = await ctx.db
    .insert(stores)
    .values({ companyId: company.id, name: `${name} – Hillside`, timeZone: "America/New_York" })
    .returning();
  const hash = await bcrypt.hash(PASSWORD, 4);
  const slug = name.toLowerCase().replace(/[^a-z]+/g, "");
  const people = {} as Record<Role, { email: string; userId: string; membershipId: string }>;
  for (const role of ["owner", "lead-tech", "technician", "engineer", "store-contact"] as Role[]) {
    const email = `${role}@${slug}.test`;
    const [user] = await ctx.db
      .insert(users)
      .values({ email, name: `${role} of ${name}`, passwordHash: hash })
      .returning();
    const [m] = await ctx.db.insert(memberships).values({ companyId: company.id, userId: user.id, role }).returning();
    if (role === "store-contact")
      await ctx.db.insert(membershipStores).values({ membershipId: m.id, storeId: store.id });
    people[role] = { email, userId: user.id, membershipId: m.id };
  }
  return { company, store, otherStore, people };
}

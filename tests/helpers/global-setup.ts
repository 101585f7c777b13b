import { ensureTemplateDatabase } from "./test-db";

// Server and browser suites need the throw-away cluster that `npm test` starts; the migrated
// template every test database is copied from is made here, once, before the workers start.
export default async function setup() {
  if (!process.env.TEST_ADMIN_DATABASE_URL) {
    throw new Error(
      "TEST_ADMIN_DATABASE_URL is not set: run the suites through `npm test`, which starts the test database.",
    );
  }
  await ensureTemplateDatabase();
}

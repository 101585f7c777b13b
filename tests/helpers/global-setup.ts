// Server and browser suites need the throw-away cluster that `npm test` starts.
export default function setup() {
  if (!process.env.TEST_ADMIN_DATABASE_URL) {
    throw new Error(
      "TEST_ADMIN_DATABASE_URL is not set: run the suites through `npm test`, which starts the test database.",
    );
  }
}

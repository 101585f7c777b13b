// The import walls of Plumeline, checked by `npm run check:walls` (part of `npm test`).
// Why these walls: docs/decisions/0002-import-walls.md. Each rule names the layer it protects;
// tests/walls/walls.test.ts proves every rule fires on a deliberate violation.

/** npm packages the isomorphic core may use: pure computation, no I/O, no DOM. */
const CORE_PACKAGES = ["zod", "d3-scale", "d3-interpolate", "papaparse", "simple-statistics", "vitest"];

/** @type {import('dependency-cruiser').IConfiguration} */
module.exports = {
  forbidden: [
    {
      name: "features-are-independent",
      comment: "A client feature never imports another feature; routes in src/app are where features meet.",
      severity: "error",
      from: { path: "^src/features/([^/]+)/" },
      to: { path: "^src/features/([^/]+)/", pathNot: "^src/features/$1/" },
    },
    {
      name: "shared-client-code-imports-no-feature",
      comment: "src/components, src/lib and src/entities are shared by features, so they import none.",
      severity: "error",
      from: { path: "^src/(components|lib|entities)/" },
      to: { path: "^src/(features|app)/" },
    },
    {
      name: "client-imports-only-core",
      comment: "The browser bundle takes nothing from server/ or scripts/; shared code lives in core/.",
      severity: "error",
      from: { path: "^src/" },
      to: { path: "^(server|scripts)/" },
    },
    {
      name: "client-code-imports-no-test-helpers",
      comment: "Only client tests may use tests/helpers.",
      severity: "error",
      from: { path: "^src/", pathNot: "\\.test\\.tsx?$" },
      to: { path: "^tests/" },
    },
    {
      name: "client-imports-no-node",
      comment: "The client runs in the browser: no Node built-ins.",
      severity: "error",
      from: { path: "^src/" },
      to: { dependencyTypes: ["core"] },
    },
    {
      name: "core-stays-in-core",
      comment: "core/ runs in the browser and in Node alike: it imports nothing of the client, server or tools.",
      severity: "error",
      from: { path: "^core/" },
      to: { path: "^(src|server|scripts|tests)/" },
    },
    {
      name: "core-imports-no-node",
      comment: "core/ has no I/O: no Node built-ins.",
      severity: "error",
      from: { path: "^core/" },
      to: { dependencyTypes: ["core"] },
    },
    {
      name: "core-uses-only-pure-packages",
      comment: "core/ may use only the pure packages listed in CORE_PACKAGES (no express, drizzle, pg, react, DOM).",
      severity: "error",
      from: { path: "^core/" },
      to: {
        dependencyTypes: ["npm", "npm-dev", "npm-optional", "npm-peer", "npm-no-pkg", "npm-unknown"],
        pathNot: `node_modules/(${CORE_PACKAGES.join("|")})/`,
      },
    },
    {
      name: "server-imports-no-client",
      comment: "The server never imports the React client.",
      severity: "error",
      from: { path: "^server/" },
      to: { path: "^src/" },
    },
    {
      name: "db-imports-no-route-or-service",
      comment: "The data layer and the demo seed build on the schema, never on HTTP routes or services.",
      severity: "error",
      from: { path: "^server/db/" },
      to: { path: "^server/(api|middleware)/" },
    },
    {
      name: "jobs-import-no-route",
      comment: "Jobs run outside any request: they never import a router or a middleware.",
      severity: "error",
      from: { path: "^server/jobs/" },
      to: { path: "(^server/middleware/|\\.router\\.ts$)" },
    },
    {
      name: "simulator-never-sees-the-locator",
      comment: "The benchmark's simulator must not share physics with the locator it grades.",
      severity: "error",
      from: { path: "^scripts/bench/simulate/" },
      to: { path: "^core/analysis/" },
    },
    {
      name: "no-cycles",
      comment: "Import cycles make load order matter and layers blur.",
      severity: "error",
      from: {},
      to: { circular: true },
    },
    {
      name: "no-unresolvable-imports",
      comment: "Every import resolves to a file or an installed package.",
      severity: "error",
      from: {},
      to: { couldNotResolve: true },
    },
  ],
  options: {
    doNotFollow: { path: "node_modules" },
    exclude: { path: "^(dist|drizzle|\\.data|uploads)/" },
    tsConfig: { fileName: "tsconfig.json" },
    // Type-only imports count: a type from server/ in the client is still a wall crossed.
    tsPreCompilationDeps: true,
    combinedDependencies: false,
    enhancedResolveOptions: {
      exportsFields: ["exports"],
      conditionNames: ["import", "require", "node", "default", "types"],
      extensions: [".ts", ".tsx", ".mjs", ".js", ".d.ts"],
      mainFields: ["module", "main", "types", "typings"],
    },
  },
};

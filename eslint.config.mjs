import nextVitals from "eslint-config-next/core-web-vitals";
import nextTs from "eslint-config-next/typescript";
import drizzle from "eslint-plugin-drizzle";

// The layers (DEVELOPERS.md, "Layers"): a request enters in app/, an operation in lib/ops decides,
// db/queries reads and writes. Imports may only point down that list.
const DB = { regex: "^(@/db|(\\.\\.?/)+db)(/|$)", message: "Only lib/ops (and db/) reach the database." };
const OPS = {
  regex: "^(@/lib/ops|(\\.\\.?/)+(lib/)?ops)(/|$)",
  message: "lib/ops is the top of the stack: call it, do not import it from below.",
};
const AUTH_HTTP = {
  regex: "^(@/lib/(auth|http)|(\\.\\.?/)+(lib/)?(auth|http))(/|$)",
  message: "The query layer only reads and writes: decisions and requests stay in lib/ops, lib/auth and lib/http.",
};
const FRAMEWORK = {
  regex: "^(next|next-auth|react|react-dom)(/|$)",
  message: "Pure lib/ code runs anywhere: no framework.",
};
const restrict = (...patterns) => ["error", { patterns }];

const config = [
  ...nextVitals,
  ...nextTs,
  {
    plugins: { drizzle },
    rules: {
      // Every update and delete on a table carries a where clause.
      "drizzle/enforce-delete-with-where": ["error", { drizzleObjectName: ["db", "tx"] }],
      "drizzle/enforce-update-with-where": ["error", { drizzleObjectName: ["db", "tx"] }],
    },
  },
  {
    files: ["app/**/*.{ts,tsx}", "components/**/*.{ts,tsx}"],
    // The health check reads the pool itself: it must answer when lib/ops cannot.
    ignores: ["app/api/health/route.ts"],
    rules: { "no-restricted-imports": restrict(DB) },
  },
  {
    files: ["db/queries/**/*.ts"],
    rules: { "no-restricted-imports": restrict(OPS, AUTH_HTTP) },
  },
  {
    files: ["lib/**/*.{ts,tsx}"],
    // Impure by design: operations, sessions, requests, and the PDF renderer (react-pdf is React).
    ignores: ["lib/ops/**", "lib/auth/**", "lib/http/**", "lib/poster/pdf/**"],
    rules: { "no-restricted-imports": restrict(OPS, DB, FRAMEWORK) },
  },
  {
    files: ["**/*.{ts,tsx,mjs}"],
    rules: { "import/no-cycle": ["error", { ignoreExternal: true }] },
  },
  {
    ignores: [
      ".next/**",
      ".next-*/**",
      ".data/**",
      "node_modules/**",
      "drizzle/**",
      "next-env.d.ts",
      "test-results/**",
      "playwright-report/**",
    ],
  },
];

export default config;

// ESLint: TypeScript, React hooks, accessibility and the one-way import rules of DEVELOPERS.md.
import js from "@eslint/js";
import boundaries from "eslint-plugin-boundaries";
import jsxA11y from "eslint-plugin-jsx-a11y";
import reactHooks from "eslint-plugin-react-hooks";
import globals from "globals";
import tseslint from "typescript-eslint";

/** Where each kind of code lives; the import rules below are written in these names. */
const elements = [
  { type: "client-app", pattern: "src/app" },
  { type: "client-pad", pattern: "src/pad" },
  { type: "client-feature", pattern: "src/features/*", capture: ["feature"] },
  { type: "client-shared", pattern: ["src/components", "src/lib"] },
  { type: "server-routes", pattern: "server/routes" },
  { type: "server-realtime", pattern: "server/realtime" },
  { type: "server-services", pattern: "server/services" },
  { type: "server-db", pattern: "server/db" },
  { type: "server-core", pattern: ["server/middleware", "server/mail", "server/set-finder", "server/limits", "server/pooling"] },
  // Files at the top of server/ (app.ts, index.ts, env.ts, logger.ts, auth.ts, run-notifier.ts…): the composition root and its settings.
  { type: "server-root", pattern: "server" },
  { type: "shared", pattern: "shared" },
];

const serverCore = ["server-root", "server-core", "server-db", "shared"];

/** A policy: elements of type `from` may import elements of the types `to`. */
const allow = (from, to) => ({ from: { element: { type: from } }, allow: { to: { element: { type: to } } } });

export default tseslint.config(
  { ignores: ["dist/**", "node_modules/**", "drizzle/**", ".data/**", "screenshots/**", "public/**", "dev-dist/**"] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.browser, ...globals.node } },
    rules: {
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_", caughtErrors: "none" }],
      "@typescript-eslint/no-explicit-any": "error",
      "max-len": ["error", { code: 160, ignoreUrls: true, ignoreStrings: true, ignoreTemplateLiterals: true, ignoreRegExpLiterals: true }],
    },
  },
  {
    files: ["src/**/*.{ts,tsx}"],
    plugins: { "react-hooks": reactHooks, "jsx-a11y": jsxA11y },
    rules: {
      // The classic hook rules: we do not compile with the React Compiler, so its extra rules (purity, refs in render…) do not apply.
      "react-hooks/rules-of-hooks": "error",
      "react-hooks/exhaustive-deps": "error",
      ...jsxA11y.flatConfigs.recommended.rules,
      // A scrollable table sits in a focusable, labelled region so keyboard users can scroll it (axe: scrollable-region-focusable).
      "jsx-a11y/no-noninteractive-tabindex": ["error", { tags: [], roles: ["tabpanel", "region"], allowExpressionValues: true }],
      // A checkbox's label may hold its text two spans deep (a bold name above a hint).
      "jsx-a11y/label-has-associated-control": ["error", { depth: 3 }],
    },
  },
  {
    files: ["src/**/*.{ts,tsx}", "server/**/*.ts", "shared/**/*.ts"],
    plugins: { boundaries },
    settings: {
      "boundaries/elements": elements,
      "import/resolver": { typescript: { project: "./tsconfig.json" } },
    },
    rules: {
      "boundaries/dependencies": [
        "error",
        {
          default: "disallow",
          message: "{{ from.element.type }} may not import {{ to.element.type }} (imports flow one way: DEVELOPERS.md, Layout)",
          policies: [
            allow("client-pad", ["client-pad", "client-feature", "client-shared", "shared"]),
            allow("client-app", ["client-app", "client-feature", "client-shared", "shared"]),
            // A feature imports its own files (one element per feature folder, so they are internal) and never another feature's.
            allow("client-feature", ["client-shared", "shared"]),
            allow("client-shared", ["client-shared", "shared"]),
            allow("server-root", ["server-routes", "server-realtime", "server-services", ...serverCore]),
            allow("server-routes", ["server-routes", "server-services", ...serverCore]),
            allow("server-realtime", ["server-realtime", "server-services", ...serverCore]),
            allow("server-services", ["server-services", ...serverCore]),
            allow("server-db", ["server-db", "server-root", "server-core", "shared"]),
            allow("server-core", serverCore),
            allow("shared", ["shared"]),
          ],
        },
      ],
    },
  },
);

// ESLint: TypeScript, React hooks, accessibility and the one-way import rules of DEVELOPERS.md.
import js from "@eslint/js";
import boundaries from "eslint-plugin-boundaries";
import jsxA11y from "eslint-plugin-jsx-a11y";
import reactHooks from "eslint-plugin-react-hooks";
import globals from "globals";
import tseslint from "typescript-eslint";

/** Where each kind of code lives; the import rules below are written in these names. */
const elements = [
  { type: "client-app", pattern: "src/app/**" },
  { type: "client-feature", pattern: "src/features/*/**", capture: ["feature"] },
  { type: "client-shared", pattern: ["src/components/**", "src/lib/**"] },
  { type: "client-entry", pattern: ["src/*.ts", "src/*.tsx"], mode: "file" },
  { type: "server-entry", pattern: ["server/index.ts", "server/app.ts", "server/http-server.ts"], mode: "file" },
  { type: "server-routes", pattern: "server/routes/**" },
  { type: "server-realtime", pattern: "server/realtime/**" },
  { type: "server-services", pattern: "server/services/**" },
  { type: "server-db", pattern: "server/db/**" },
  { type: "server-core", pattern: ["server/*.ts", "server/middleware/**", "server/mail/**", "server/set-finder/**", "server/**"] },
  { type: "shared", pattern: "shared/**" },
];

const serverCore = ["server-core", "server-db", "shared"];

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
      ...reactHooks.configs.recommended.rules,
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
      "boundaries/element-types": [
        "error",
        {
          default: "disallow",
          message: "${file.type} may not import ${dependency.type} (imports flow one way: DEVELOPERS.md, Layout)",
          rules: [
            { from: "client-entry", allow: ["client-app", "client-shared", "shared"] },
            { from: "client-app", allow: ["client-app", "client-feature", "client-shared", "shared"] },
            { from: "client-feature", allow: [["client-feature", { feature: "${from.feature}" }], "client-shared", "shared"] },
            { from: "client-shared", allow: ["client-shared", "shared"] },
            { from: "server-entry", allow: ["server-entry", "server-routes", "server-realtime", "server-services", ...serverCore] },
            { from: "server-routes", allow: ["server-routes", "server-services", ...serverCore] },
            { from: "server-realtime", allow: ["server-realtime", "server-services", ...serverCore] },
            { from: "server-services", allow: ["server-services", ...serverCore] },
            { from: "server-db", allow: ["server-db", "server-core", "shared"] },
            { from: "server-core", allow: serverCore },
            { from: "shared", allow: ["shared"] },
          ],
        },
      ],
    },
  },
);

// ESLint flat config. `npm test` runs it (scripts/test.mjs) and fails on any error.
// Besides the usual TypeScript, React and Next.js rules it enforces the layout's boundaries
// (DEVELOPERS.md): the core imports nothing outside itself, client code never reaches server code
// or the models, and only a feature's repo file touches `models/`.
import js from "@eslint/js";
import nextPlugin from "@next/eslint-plugin-next";
import prettier from "eslint-config-prettier";
import reactHooks from "eslint-plugin-react-hooks";
import globals from "globals";
import tseslint from "typescript-eslint";
import { clientBoundary } from "./scripts/lint/client-boundary.mjs";

const SERVER_OR_MODELS = [
  {
    regex: "^\\.\\./",
    message: "Import across folders with an @/ path, so the boundaries below can be checked.",
  },
  {
    regex: "(^|/)(lib/server|models)(/|$)",
    message: "Client code must not import server code or models; take types from lib/schemas or lib/domain.",
  },
];

const MODELS = {
  regex: "^(@/models|(\\.\\./)+models)(/|$)",
  message: "Only a feature's repo file (lib/server/<feature>/repo.ts) imports models/; call the repo.",
};

const DOMAIN_ONLY = [
  {
    regex: "^(?!\\./|decimal\\.js-light$)",
    message: "lib/domain is the pure core: it imports only its own files (and decimal.js-light).",
  },
];

// A feature folder inside the core (lib/domain/bearings/) may also reach the core's own files one level up.
// Gauge studies (lib/domain/gauge-studies/) also take Student's t and F distributions from jstat (pure; @stdlib's
// compile polynomials with new Function at load, which the pages' Content-Security-Policy refuses).
const DOMAIN_FEATURE_ONLY = [
  {
    regex: "^(?!\\./|\\.\\./(?!\\.\\.)|decimal\\.js-light$|jstat$)",
    message:
      "lib/domain is the pure core: a feature folder imports only the core's files " +
      "(and decimal.js-light, jstat's t and F distributions).",
  },
];

export default tseslint.config(
  {
    ignores: [
      "node_modules/**",
      ".next/**",
      ".next-*/**",
      ".data/**",
      "backups/**",
      "public/sw.js",
      "public/swe-worker-*.js",
      "next-env.d.ts",
      "coverage/**",
    ],
  },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.browser, ...globals.node } },
    plugins: { "@next/next": nextPlugin, "react-hooks": reactHooks, tenthwise: { rules: { clientBoundary } } },
    rules: {
      ...nextPlugin.configs.recommended.rules,
      ...nextPlugin.configs["core-web-vitals"].rules,
      "react-hooks/rules-of-hooks": "error",
      "react-hooks/exhaustive-deps": "warn",
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_" }],
      "@typescript-eslint/consistent-type-imports": [
        "error",
        // `typeof import("./x")` names the type of a module loaded later on purpose (lazy code).
        { fixStyle: "inline-type-imports", disallowTypeAnnotations: false },
      ],
      "tenthwise/clientBoundary": "error",
    },
    linterOptions: { reportUnusedDisableDirectives: "error" },
  },
  // The bench leaves its offline shell with full page loads on purpose: plain links keep the client
  // router out of its first load, and signing out of a shared tablet drops every in-memory state.
  {
    files: ["components/bench/**/*.tsx", "components/header-bar.tsx", "components/sign-out-button.tsx"],
    rules: {
      "@next/next/no-html-link-for-pages": "off",
      "@next/next/no-location-assign-relative-destination": "off",
    },
  },
  // Photos come from our own signed-in upload route; Next's image optimiser would fetch them
  // without the user's session.
  {
    files: ["components/flags/flag-history.tsx"],
    rules: { "@next/next/no-img-element": "off" },
  },
  {
    files: ["lib/domain/**/*.ts"],
    rules: { "no-restricted-imports": ["error", { patterns: DOMAIN_ONLY }] },
  },
  {
    files: ["lib/domain/*/**/*.ts"],
    rules: { "no-restricted-imports": ["error", { patterns: DOMAIN_FEATURE_ONLY }] },
  },
  {
    files: [
      "components/**/*.{ts,tsx}",
      "hooks/**/*.{ts,tsx}",
      "lib/offline/**/*.ts",
      "lib/client/**/*.ts",
      "app/**/_components/**/*.{ts,tsx}",
      "app/providers.tsx",
      "app/sw.ts",
    ],
    rules: { "no-restricted-imports": ["error", { patterns: SERVER_OR_MODELS }] },
  },
  {
    files: ["app/**/*.{ts,tsx}", "lib/server/**/*.{ts,tsx}", "lib/schemas/**/*.ts", "instrumentation.ts"],
    ignores: ["app/**/_components/**", "lib/server/*/repo.ts", "lib/server/core/db.ts"],
    rules: { "no-restricted-imports": ["error", { patterns: [MODELS] }] },
  },
  prettier,
);

// Shared lint rules for every workspace: the recommended sets, the few habits we care about, and
// one type-aware rule: a promise nobody awaits, returns or marks `void` is a bug (its rejection
// goes unhandled and its order is anyone's guess).
import js from "@eslint/js";
import tseslint from "typescript-eslint";
import globals from "globals";

/** Apps (apps/*) use packages; no package, test or other app imports an app. */
const APPS_ARE_LEAVES = {
  regex: "^@contend/(server|web)(/|$)|(^|/)apps/",
  message: "Apps are leaves: move what you need from the app into a package (packages/*).",
};

/** ".", "..", "../..", "./index", "../sweep/index": a barrel rather than the defining module. */
const NO_OWN_BARREL = {
  regex: "^\\.{1,2}(/\\.{1,2})*/?$|^\\.{1,2}/(.*/)?index(\\.[cm]?[jt]sx?)?$",
  message: "Import the module that defines the name, not an index barrel of this package.",
};

export default tseslint.config(
  {
    ignores: [
      "**/dist/**",
      "**/.next/**",
      "**/node_modules/**",
      "**/next-env.d.ts",
      "**/generated/**",
      "**/test-results/**",
      "**/playwright-report/**",
    ],
  },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node, ...globals.browser } },
    rules: {
      "@typescript-eslint/no-unused-vars": [
        "error",
        { argsIgnorePattern: "^_", varsIgnorePattern: "^_" },
      ],
      "@typescript-eslint/consistent-type-imports": "error",
      eqeqeq: ["error", "always"],
      "no-console": "off",
      "no-restricted-imports": ["error", { patterns: [APPS_ARE_LEAVES] }],
    },
  },
  {
    files: ["**/*.{ts,tsx,mts,cts}"],
    languageOptions: {
      // each file is checked with the tsconfig.json of its workspace
      parserOptions: { projectService: true, tsconfigRootDir: process.cwd() },
    },
    rules: {
      "@typescript-eslint/no-floating-promises": "error",
    },
  },
  {
    // Inside a workspace's source, a barrel (index) only re-exports: importing it from a module
    // it re-exports makes an import cycle. Tests may use the public index.
    files: ["src/**/*.{ts,tsx,js,mjs}"],
    rules: {
      "no-restricted-imports": ["error", { patterns: [APPS_ARE_LEAVES, NO_OWN_BARREL] }],
    },
  },
);

// ESLint flat config (`npm run lint`). Besides the usual TypeScript and React checks it holds the seams between the
// three halves of the code: shared/ stands alone, the client sees the server only through presenter types, and a
// server module reads another module's tables through that module's service, never its queries.
import { readdirSync } from "node:fs";
import js from "@eslint/js";
import { defineConfig } from "eslint/config";
import tseslint from "typescript-eslint";
import reactHooks from "eslint-plugin-react-hooks";
import pluginQuery from "@tanstack/eslint-plugin-query";
import globals from "globals";

// Import sources are matched as written, and every import in this repo is relative (no path aliases), so each rule
// is a regular expression over the relative path: "../" any number of times, then the folder it must not reach.
const serverModules = readdirSync(new URL("./server/modules", import.meta.url), { withFileTypes: true })
  .filter((entry) => entry.isDirectory())
  .map((entry) => entry.name);

const restrict = (patterns, syntax = []) => ({
  "@typescript-eslint/no-restricted-imports": ["error", { patterns }],
  "no-restricted-syntax": ["error", ...syntax],
});
const presenter = String.raw`modules/[^/]+/[^/]+\.presenter\.ts$`;

export default defineConfig(
  { ignores: ["dist/", "node_modules/", "drizzle/", "test-results/", ".data/", "uploads/", "fonts/"] },
  { linterOptions: { reportUnusedDisableDirectives: "error" } },

  js.configs.recommended,
  tseslint.configs.recommendedTypeChecked,
  {
    languageOptions: {
      parserOptions: { projectService: true, tsconfigRootDir: import.meta.dirname },
    },
  },
  {
    rules: {
      // A leading underscore marks a parameter or binding kept on purpose (Express's four-argument error handler, an
      // omitted field in `const { secret: _secret, ...rest }`).
      "@typescript-eslint/no-unused-vars": [
        "error",
        { argsIgnorePattern: "^_", varsIgnorePattern: "^_", caughtErrorsIgnorePattern: "^_", ignoreRestSiblings: true },
      ],
    },
  },
  {
    files: ["tests/**"],
    rules: {
      // supertest's `res.body`, `JSON.parse` and `page.evaluate` hand tests `any` on purpose: the assertions that
      // follow are the check on its shape, so typing every body first would only repeat them.
      "@typescript-eslint/no-unsafe-argument": "off",
      "@typescript-eslint/no-unsafe-assignment": "off",
      "@typescript-eslint/no-unsafe-call": "off",
      "@typescript-eslint/no-unsafe-member-access": "off",
      "@typescript-eslint/no-unsafe-return": "off",
    },
  },
  // Plain JavaScript (this file, scripts/test.mjs) is outside tsconfig.json, so it gets the rules without types.
  { files: ["**/*.{js,mjs,cjs}"], extends: [tseslint.configs.disableTypeChecked], languageOptions: { globals: globals.node } },

  {
    files: ["src/**/*.{ts,tsx}"],
    extends: [reactHooks.configs.flat.recommended, pluginQuery.configs["flat/recommended"]],
    languageOptions: { globals: globals.browser },
  },

  // Long lines: 160 leaves room for one expression per line in the wide style the code already has.
  {
    files: ["src/**/*.{ts,tsx}", "server/**/*.ts"],
    rules: {
      // Core max-len is deprecated (formatting rules moved to @stylistic) but kept until ESLint 11.
      "max-len": ["error", { code: 160, ignoreUrls: true, ignoreStrings: true, ignoreTemplateLiterals: true, ignoreRegExpLiterals: true }],
    },
  },

  // Boundaries.
  {
    files: ["shared/**"],
    rules: restrict(
      [{ regex: String.raw`^\.\.?/(.*/)?(src|server)/`, message: "shared/ is imported by both sides and imports neither." }],
      [{ selector: String.raw`:matches(ImportExpression, TSImportType)[source.value=/(^|\/)(src|server)\//]`, message: "shared/ imports neither src/ nor server/." }],
    ),
  },
  {
    files: ["src/**"],
    rules: restrict(
      [
        {
          regex: String.raw`^\.\.?/(.*/)?server/(?!${presenter})`,
          message: "The client sees the server only through presenter types (server/modules/<noun>/<noun>.presenter.ts).",
        },
        {
          regex: String.raw`^\.\.?/(.*/)?server/${presenter}`,
          allowTypeImports: true,
          message: "Import presenters with `import type`, so no server code reaches the bundle.",
        },
      ],
      [
        { selector: String.raw`ImportExpression[source.value=/(^|\/)server\//]`, message: "No server code in the client bundle." },
        {
          selector: String.raw`TSImportType[source.value=/(^|\/)server\//]:not([source.value=/\.presenter\.ts$/])`,
          message: "The client sees the server only through presenter types.",
        },
      ],
    ),
  },
  // A module reads its own tables; another module's rows come through that module's service.
  ...serverModules.map((name) => ({
    files: [`server/modules/${name}/**`],
    rules: restrict([
      {
        regex: String.raw`^\.\.?/(.*/)?(?!${name}\.)[^/]+\.queries(\.ts)?$`,
        message: `server/modules/${name} may import only its own ${name}.queries.ts; use the other module's service.`,
      },
    ]),
  })),
);

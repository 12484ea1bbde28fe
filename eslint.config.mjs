import js from "@eslint/js";
import tseslint from "typescript-eslint";
import reactHooks from "eslint-plugin-react-hooks";
import nextPlugin from "@next/eslint-plugin-next";

export default tseslint.config(
  {
    ignores: [
      "node_modules/**", ".next/**", "generated/**", "data/**", "test-results/**", "playwright-report/**",
      "next-env.d.ts", "**/*.mjs", "**/*.cjs", ".tmp/**", ".tmp-*", "**/*.tmp.ts",
    ],
  },
  js.configs.recommended,
  ...tseslint.configs.recommendedTypeChecked,
  {
    languageOptions: { parserOptions: { projectService: true, tsconfigRootDir: import.meta.dirname } },
    plugins: { "react-hooks": reactHooks, "@next/next": nextPlugin },
    rules: {
      ...reactHooks.configs.recommended.rules,
      ...nextPlugin.configs.recommended.rules,
      "@typescript-eslint/consistent-type-imports": ["error", { fixStyle: "inline-type-imports" }],
      "@typescript-eslint/no-floating-promises": "error",
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_" }],
      "no-restricted-properties": ["error", { object: "process", property: "env", message: "Read configuration through lib/env.ts." }],
    },
  },
  {
    // lib/env.ts is the one reader of the environment; scripts, tests and configs run outside the app.
    files: ["lib/env.ts", "scripts/**", "tests/**", "bench/**", "*.config.ts", "prisma.config.ts", "playwright.config.ts"],
    rules: { "no-restricted-properties": "off" },
  },
  {
    // lib/chem is pure computation: no I/O, no framework, no database, no app code.
    files: ["lib/chem/**"],
    rules: {
      "no-restricted-imports": ["error", {
        patterns: [
          { group: ["next", "next/*", "react", "react-dom", "@prisma/*", "@/generated/*", "server-only", "node:*", "fs", "path", "pg", "@electric-sql/*"], message: "lib/chem is pure: no I/O or framework imports." },
          { group: ["@/app/*", "@/lib/*", "!@/lib/chem/*"], message: "lib/chem may not import app code." },
        ],
      }],
    },
  },
);

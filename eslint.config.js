import js from "@eslint/js";
import tseslint from "typescript-eslint";
import reactHooks from "eslint-plugin-react-hooks";
import globals from "globals";

export default tseslint.config(
  { ignores: ["node_modules", "dist", ".data", "drizzle", "coverage", "demo-geo/out"] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node, ...globals.browser } },
    rules: {
      "@typescript-eslint/no-unused-vars": [
        "error",
        { argsIgnorePattern: "^_", varsIgnorePattern: "^_" },
      ],
      "@typescript-eslint/consistent-type-imports": ["error", { fixStyle: "inline-type-imports" }],
    },
  },
  {
    files: ["src/**/*.{ts,tsx}"],
    plugins: { "react-hooks": reactHooks },
    rules: {
      "react-hooks/rules-of-hooks": "error",
      "react-hooks/exhaustive-deps": "error",
    },
  },
  {
    // The isomorphic core must stay free of the client and the server (STYLE.md, boundaries).
    files: ["shared/**/*.ts"],
    rules: {
      "no-restricted-imports": [
        "error",
        {
          patterns: [
            {
              group: ["**/src/**", "../src/*", "../../src/*"],
              message: "shared/ must not import src/.",
            },
            {
              group: ["**/server/**", "../server/*", "../../server/*"],
              message: "shared/ must not import server/.",
            },
            {
              group: ["node:*", "fs", "path", "child_process"],
              message: "shared/ is isomorphic: no Node built-ins.",
            },
          ],
        },
      ],
    },
  },
);

// Lint rules for the whole project: JavaScript's and TypeScript's recommended sets, React's
// (with the new JSX runtime), the rules of hooks, and accessibility checks on JSX.
import js from "@eslint/js";
import jsxA11y from "eslint-plugin-jsx-a11y";
import react from "eslint-plugin-react";
import reactHooks from "eslint-plugin-react-hooks";
import globals from "globals";
import tseslint from "typescript-eslint";

export default tseslint.config(
  { ignores: ["build/", ".react-router/", "node_modules/", "coverage/", ".data/", "public/"] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    files: ["**/*.{ts,tsx,js}"],
    plugins: { react, "react-hooks": reactHooks, "jsx-a11y": jsxA11y },
    languageOptions: { globals: { ...globals.browser, ...globals.node } },
    settings: { react: { version: "detect" } },
    rules: {
      ...react.configs.recommended.rules,
      ...react.configs["jsx-runtime"].rules,
      ...jsxA11y.flatConfigs.recommended.rules,
      "react-hooks/rules-of-hooks": "error",
      "react-hooks/exhaustive-deps": "warn",
      // TypeScript checks props; an unused name is allowed when it starts with _ (a rest-spread that drops a key).
      "react/prop-types": "off",
      // Apostrophes and quotes are fine as JSX text; only > and } are easy slips.
      "react/no-unescaped-entities": ["error", { forbid: [">", "}"] }],
      // Choice cards nest their text a level deeper than the rule looks by default.
      "jsx-a11y/label-has-associated-control": ["error", { depth: 3 }],
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_", destructuredArrayIgnorePattern: "^_" }],
    },
  },
);

import nextVitals from "eslint-config-next/core-web-vitals";
import nextTs from "eslint-config-next/typescript";

const config = [
  ...nextVitals,
  ...nextTs,
  {
    ignores: [".next/**", "node_modules/**", ".data/**", "next-env.d.ts", "test-results/**", "playwright-report/**", "artifacts/**"],
  },
  {
    rules: {
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_" }],
      // Advice for the React Compiler, which this project does not enable; react-hook-form's watch() triggers it.
      "react-hooks/incompatible-library": "off",
    },
  },
];
export default config;

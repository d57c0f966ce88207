import type { Config } from "tailwindcss";

/** Sievewright's own calm palette: warm paper, ink, a moss accent; positive and negative DEP get ember and tide. */
const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        paper: { DEFAULT: "#f6f4ef", deep: "#ebe7dc", line: "#d9d4c7" },
        ink: { DEFAULT: "#1f2933", soft: "#3e4c59", muted: "#616e7c" },
        moss: { DEFAULT: "#3f6b58", dark: "#2c4d3f", light: "#dce9e2" },
        ember: { DEFAULT: "#a4471c", light: "#f5e1d6" },
        tide: { DEFAULT: "#2f4f8f", light: "#dfe6f4" },
        caution: { DEFAULT: "#8a5a00", light: "#fbf0d3" },
        danger: { DEFAULT: "#9b1c1c", light: "#fbe3e3" },
      },
      fontFamily: { sans: ["var(--font-inter)", "DejaVu Sans", "system-ui", "sans-serif"] },
    },
  },
};
export default config;

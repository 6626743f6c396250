import type { Config } from "tailwindcss";

// Ovenward's design tokens. Slate ink on warm paper, one ember accent used sparingly,
// and four health colours that always travel with a word and a shape.
const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}", "./emails/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        ink: { DEFAULT: "#1c2126", soft: "#3d454d", muted: "#5b636b", faint: "#687077" },
        paper: { DEFAULT: "#faf7f2", raised: "#ffffff", sunk: "#f1ece4", line: "#e2dbd0" },
        ember: { DEFAULT: "#c2410c", strong: "#9a3412", soft: "#fde8dc", ring: "#ea580c" },
        health: {
          steady: "#0f766e",
          watch: "#b45309",
          act: "#9f1239",
          down: "#57534e",
        },
      },
      fontFamily: {
        sans: ["'IBM Plex Sans Variable'", "system-ui", "sans-serif"],
      },
      borderRadius: { card: "10px" },
    },
  },
};

export default config;

import type { Config } from "tailwindcss";

// Threadline's palette: one deep accent (a dark teal-blue, "thread") and neutrals; state colours are
// picked for contrast and always come with a word and a glyph (see src/components/status).
export default {
  content: ["./src/**/*.{ts,tsx}"],
  darkMode: "class",
  theme: {
    extend: {
      colors: {
        thread: {
          50: "#eef6f8",
          100: "#d5e8ee",
          200: "#a9d0dc",
          300: "#6fb0c3",
          500: "#1f6f8b",
          600: "#175a72",
          700: "#12475b",
          800: "#0d3444",
          900: "#08222d",
        },
      },
      fontFamily: {
        sans: ["var(--font-text)", "system-ui", "sans-serif"],
        mono: ["var(--font-mono)", "ui-monospace", "monospace"],
      },
      minHeight: { touch: "44px", glove: "48px" },
      minWidth: { touch: "44px", glove: "48px" },
    },
  },
} satisfies Config;

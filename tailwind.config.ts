import type { Config } from "tailwindcss";

// Forkwall's design tokens: a calm clinical palette (deep teal on warm off-white), with status
// colours chosen to stay distinct for colour-blind readers and always paired with a word or mark.
export default {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        ink: { DEFAULT: "#17212b", soft: "#3d4b59", faint: "#66727f" },
        paper: { DEFAULT: "#f7f8f6", raised: "#ffffff", sunk: "#eef1ef" },
        line: { DEFAULT: "#d5dbdf", strong: "#a9b4bc" },
        brand: {
          50: "#eef7f8",
          100: "#d3ebef",
          200: "#a6d4dc",
          500: "#2a7f91",
          600: "#1d6576",
          700: "#164f5d",
          800: "#113d48",
        },
        ok: { DEFAULT: "#1d5fa8", soft: "#e5effa" },
        warn: { DEFAULT: "#8a5300", soft: "#fdf1dc" },
        danger: { DEFAULT: "#a3261f", soft: "#fbe9e7" },
        review: { DEFAULT: "#5b3a8c", soft: "#f1ebf8" },
      },
      fontFamily: {
        sans: ["Inter", "system-ui", "sans-serif"],
      },
      spacing: { gutter: "1.5rem", section: "3rem" },
      maxWidth: { page: "72rem" },
      borderRadius: { card: "0.75rem" },
    },
  },
} satisfies Config;

import localFont from "next/font/local";

// Inter (SIL Open Font License, fonts/OFL.txt), shipped in fonts/ and served from this origin.
export const inter = localFont({
  src: [
    { path: "../fonts/Inter-Regular.ttf", weight: "400", style: "normal" },
    { path: "../fonts/Inter-SemiBold.ttf", weight: "600", style: "normal" },
    { path: "../fonts/Inter-Bold.ttf", weight: "700", style: "normal" },
  ],
  variable: "--font-sans",
  display: "swap",
  fallback: ["system-ui", "sans-serif"],
});

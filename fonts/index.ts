import localFont from "next/font/local";

// Atkinson Hyperlegible Next (SIL Open Font License, see OFL-LICENSE.txt): designed for
// legibility, which suits a projector at the back of a lab and a phone at the bench.
export const bodyFont = localFont({
  src: [
    { path: "./atkinson-hyperlegible-next-latin-wght-normal.woff2", style: "normal", weight: "200 800" },
    { path: "./atkinson-hyperlegible-next-latin-wght-italic.woff2", style: "italic", weight: "200 800" },
    { path: "./atkinson-hyperlegible-next-latin-ext-wght-normal.woff2", style: "normal", weight: "200 800" },
  ],
  variable: "--font-body",
  display: "swap",
  fallback: ["system-ui", "Segoe UI", "Arial", "sans-serif"],
});

import type { Config } from "tailwindcss";

// Loopwright design tokens (../shared/design/brief.md, "Design language"): muted neutrals,
// colour reserved for traces and abnormal states, alarm red only for alarms.
export const traceColors = {
  pv: "#4a6f8f", // steel blue: PV as measured
  pvFiltered: "#4b4fa6", // indigo: PV after the filter
  sp: "#4a4a4a", // graphite, drawn dashed
  truth: "#2f8f86", // teal: true air temperature (training aid)
  out: "#d9692b", // ember orange: OUT on its own 0–100 % axis
} as const;

const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        paper: { DEFAULT: "#f6f5f1", raised: "#fbfaf7", sunk: "#eceae4" },
        ink: { DEFAULT: "#1f2326", soft: "#4b5258", faint: "#5f666c" }, // faint keeps 4.5:1 on paper-sunk (WCAG 2.1 AA)
        rule: { DEFAULT: "#d8d5cc", strong: "#b9b5aa" },
        trace: traceColors,
        alarm: { DEFAULT: "#c62828", soft: "#fbe9e7" },
        caution: { DEFAULT: "#735a18", soft: "#f7f0da" }, // 4.5:1 on paper-sunk
        ok: { DEFAULT: "#3d6b4f" },
      },
      fontFamily: {
        sans: ["var(--font-plex-sans)", "system-ui", "sans-serif"],
        mono: ["var(--font-plex-mono)", "ui-monospace", "monospace"],
      },
      borderWidth: { hairline: "0.5px" },
      fontSize: { readout: ["1.75rem", { lineHeight: "2rem" }] },
    },
  },
};
export default config;

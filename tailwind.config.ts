import type { Config } from "tailwindcss";

// Tenthwise design tokens. Colours are CSS variables (set in app/globals.css) so the
// bright shop-floor theme and the dim bench theme swap with one class on <html>.
// Verdict colours never stand alone: components pair them with a text label and a shape.
const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}", "./hooks/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        paper: "rgb(var(--c-paper) / <alpha-value>)",
        panel: "rgb(var(--c-panel) / <alpha-value>)",
        ink: "rgb(var(--c-ink) / <alpha-value>)",
        muted: "rgb(var(--c-muted) / <alpha-value>)",
        rule: "rgb(var(--c-rule) / <alpha-value>)",
        brass: "rgb(var(--c-brass) / <alpha-value>)",
        "brass-ink": "rgb(var(--c-brass-ink) / <alpha-value>)",
        steel: "rgb(var(--c-steel) / <alpha-value>)",
        "steel-ink": "rgb(var(--c-steel-ink) / <alpha-value>)",
        pass: "rgb(var(--c-pass) / <alpha-value>)",
        "pass-soft": "rgb(var(--c-pass-soft) / <alpha-value>)",
        watch: "rgb(var(--c-watch) / <alpha-value>)",
        "watch-soft": "rgb(var(--c-watch-soft) / <alpha-value>)",
        fail: "rgb(var(--c-fail) / <alpha-value>)",
        "fail-soft": "rgb(var(--c-fail-soft) / <alpha-value>)",
      },
      fontFamily: {
        sans: ["var(--font-sans)", "system-ui", "sans-serif"],
        mono: ["var(--font-mono)", "ui-monospace", "monospace"],
      },
      fontSize: {
        readout: ["4.5rem", { lineHeight: "1", letterSpacing: "-0.02em" }],
      },
      spacing: {
        tap: "4.5rem", // 72 px: comfortably above the 64 px glove target
      },
      borderRadius: {
        tool: "0.375rem",
      },
    },
  },
};

export default config;

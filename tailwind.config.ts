import type { Config } from "tailwindcss";

/**
 * Flueward's palette: a deep slate for structure, a warm copper accent for actions, and status
 * colours chosen for contrast on white in bright daylight on a phone.
 */
const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}", "./lib/**/*.{ts,tsx}"],
  theme: {
    extend: {
      fontFamily: {
        sans: ["var(--font-sans)", "system-ui", "sans-serif"],
      },
      colors: {
        ink: {
          50: "#f5f7f8",
          100: "#e7ecee",
          200: "#cfd8dc",
          300: "#a9b8bf",
          400: "#7d929b",
          500: "#5c727c",
          600: "#475a63",
          700: "#394851",
          800: "#283239",
          900: "#1a2126",
        },
        copper: {
          50: "#fdf6f0",
          100: "#f9e6d6",
          200: "#f1c9a8",
          300: "#e6a373",
          400: "#d97f47",
          500: "#c4642b",
          600: "#a74f22",
          700: "#853e1e",
          800: "#6a331d",
          900: "#572b1a",
        },
        pass: { DEFAULT: "#1f7a4d", soft: "#e3f4ea" },
        fail: { DEFAULT: "#b3261e", soft: "#fbe7e5" },
        warn: { DEFAULT: "#8a5a00", soft: "#fdf1d8" },
        info: { DEFAULT: "#2b5a9e", soft: "#e5eefa" },
        // Not applicable: a muted violet of its own, always with the words "Not applicable" and a dashed edge.
        na: { DEFAULT: "#65508a", soft: "#f1edf7" },
      },
    },
  },
  plugins: [],
};

export default config;

import type { Config } from "tailwindcss";

/**
 * Rillmark's palette: slate "ink" for text and chrome, a water "rill" teal for actions and
 * focus, warm "caution" amber for engineering cautions, "brick" for destructive actions and
 * errors, and an off-white "paper" ground.
 */
export default {
  content: ["./index.html", "./src/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        ink: {
          50: "#f4f7f8",
          100: "#e8eef0",
          200: "#d3dde1",
          300: "#b3c2c9",
          400: "#8a9da6",
          500: "#5f727c",
          600: "#4c5f69",
          700: "#3a4b54",
          800: "#263640",
          900: "#18252e",
          950: "#0e171d",
        },
        rill: {
          50: "#effaf9",
          100: "#d5f2ef",
          200: "#ade3df",
          300: "#77ccc8",
          400: "#43b0ad",
          500: "#239492",
          600: "#177778",
          700: "#155f61",
          800: "#154d50",
          900: "#143f42",
          950: "#062729",
        },
        caution: {
          50: "#fff8eb",
          100: "#fdedc9",
          200: "#fad78d",
          300: "#f6bb51",
          400: "#f2a12b",
          500: "#d98013",
          600: "#b8600d",
          700: "#93450f",
          800: "#783713",
          900: "#632e13",
        },
        brick: {
          50: "#fdf4f2",
          100: "#fbe5e1",
          200: "#f6c8c0",
          500: "#c4452f",
          600: "#a83622",
          700: "#8a2b1d",
        },
        paper: {
          DEFAULT: "#f7f6f1",
          line: "#e6ebe8",
        },
      },
      fontFamily: {
        sans: ['"Noto Sans"', "system-ui", "sans-serif"],
      },
      maxWidth: {
        page: "72rem",
      },
    },
  },
} satisfies Config;

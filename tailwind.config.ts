import type { Config } from 'tailwindcss';

// Calm neutral surfaces and one accent (a deep teal). Verdict colours come later from the
// Okabe–Ito colour-blind-safe set, always paired with a word or an icon.
const config: Config = {
  content: ['./app/**/*.{ts,tsx}', './components/**/*.{ts,tsx}'],
  theme: {
    extend: {
      fontFamily: { sans: ['var(--font-inter)', 'system-ui', 'sans-serif'] },
      colors: {
        accent: { 50: '#effaf9', 100: '#d5f1ee', 200: '#aee3de', 500: '#1b8a80', 600: '#137067', 700: '#115a54', 800: '#0f4844' },
        surface: { DEFAULT: '#fbfbf9', raised: '#ffffff', sunken: '#f2f2ee' },
        ink: { DEFAULT: '#1d2321', soft: '#4d5652', faint: '#7b847f' },
        line: { DEFAULT: '#e2e3de', strong: '#c9cbc4' },
        caution: { bg: '#fff6e0', line: '#e6b94a', ink: '#6b4b00' },
        danger: { bg: '#fdeeea', line: '#e3a08f', ink: '#8a2a12' },
      },
    },
  },
};

export default config;

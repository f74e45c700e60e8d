import type { Config } from 'tailwindcss';

// Gatefold's look: a dark work mat (`mat-*`), warm amber for a high level (a lit filament),
// cool slate for low, magenta for unknown, grey for undriven.
export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        mat: { 950: '#0d1014', 900: '#12161c', 800: '#1a2028', 700: '#242c36', 600: '#323c48', 500: '#4a5665' },
        amber: { glow: '#ffb347', 300: '#ffd08a', 400: '#ffb347', 500: '#f59e0b', 600: '#d97706' },
        slate: { cool: '#5b7a99' },
        signal: { high: '#ffb347', low: '#5b7a99', x: '#e040a0', z: '#8a8f98' },
      },
      fontFamily: {
        mono: ['"JetBrains Mono"', 'ui-monospace', 'monospace'],
        sans: ['system-ui', '-apple-system', '"Segoe UI"', 'Roboto', 'sans-serif'],
      },
    },
  },
} satisfies Config;

import type { Config } from 'tailwindcss';

/** A theme colour from its CSS variable ("r g b"), so Tailwind's opacity modifiers keep working. */
const v = (name: string) => `rgb(var(--c-${name}) / <alpha-value>)`;

// Boreline's own theme: dark ink on warm paper, a deep "tide" blue for actions and a
// high-visibility "flare" orange for attention. Verdict colours are chosen to stay
// distinguishable in sunlight and for common colour-vision deficiencies (always paired
// with a word and an icon, never colour alone).
const config: Config = {
  content: ['./app/**/*.{ts,tsx}', './components/**/*.{ts,tsx}', './lib/**/*.{ts,tsx}'],
  theme: {
    extend: {
      // Every colour is a CSS variable (app/globals.css): the "sunlight" theme swaps the values.
      colors: {
        ink: { DEFAULT: v('ink'), soft: v('ink-soft'), mute: v('ink-mute') },
        paper: { DEFAULT: v('paper'), deep: v('paper-deep'), line: v('paper-line') },
        tide: {
          50: v('tide-50'),
          100: v('tide-100'),
          500: v('tide-500'),
          600: v('tide-600'),
          700: v('tide-700'),
          900: v('tide-900'),
        },
        flare: { 100: v('flare-100'), 500: v('flare-500'), 600: v('flare-600') },
        pass: { 100: v('pass-100'), 600: v('pass-600'), 800: v('pass-800') },
        fail: { 100: v('fail-100'), 600: v('fail-600'), 800: v('fail-800') },
        doubt: { 100: v('doubt-100'), 600: v('doubt-600'), 800: v('doubt-800') },
      },
      fontFamily: {
        sans: ['var(--font-body)', 'system-ui', 'sans-serif'],
        mono: ['var(--font-figures)', 'ui-monospace', 'monospace'],
      },
      minHeight: { touch: '3rem' },
      minWidth: { touch: '3rem' },
      borderRadius: { card: '0.75rem' },
      boxShadow: { card: '0 1px 0 rgba(11,22,32,0.08), 0 2px 8px rgba(11,22,32,0.06)' },
    },
  },
  plugins: [],
};

export default config;

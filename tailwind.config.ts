import type { Config } from 'tailwindcss';

// Boreline's own theme: dark ink on warm paper, a deep "tide" blue for actions and a
// high-visibility "flare" orange for attention. Verdict colours are chosen to stay
// distinguishable in sunlight and for common colour-vision deficiencies (always paired
// with a word and an icon, never colour alone).
const config: Config = {
  content: ['./app/**/*.{ts,tsx}', './components/**/*.{ts,tsx}', './lib/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        ink: { DEFAULT: '#0b1620', soft: '#2a3a48', mute: '#51606d' },
        paper: { DEFAULT: '#fbfaf6', deep: '#f1eee4', line: '#d5d0c2' },
        tide: { 50: '#e8f1f8', 100: '#c9dfef', 500: '#1f5f8b', 600: '#174c70', 700: '#103a57', 900: '#071c2b' },
        flare: { 100: '#ffe6cc', 500: '#e86a10', 600: '#c2560a' },
        pass: { 100: '#d8f0dd', 600: '#1d7a36', 800: '#0f4d20' },
        fail: { 100: '#fbdcd9', 600: '#b3261e', 800: '#7a140f' },
        doubt: { 100: '#fff1c2', 600: '#8a6100', 800: '#5c4000' },
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

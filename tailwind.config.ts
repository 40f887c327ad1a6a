import type { Config } from 'tailwindcss';

// Boardwright's palette: slate-blue ink on warm paper, one copper accent, and three
// verdict tones that never stand alone (always with an icon and a word). Every text colour
// here reaches WCAG 2.1 AA contrast (4.5:1) on paper, raised, sunk and on its own tint
// (tests/browser/accessibility.test.ts runs axe-core over every page).
export default {
  content: ['./app/**/*.{ts,tsx}', './components/**/*.{ts,tsx}', './features/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        paper: { DEFAULT: '#f7f5f0', raised: '#ffffff', sunk: '#efece4' },
        ink: { DEFAULT: '#1f2a37', soft: '#4b5563', faint: '#5a6370' },
        line: { DEFAULT: '#dcd7cc', strong: '#b9b2a3' },
        copper: { DEFAULT: '#9f5620', dark: '#8f4c1c', light: '#f3e2d3' },
        rail: { DEFAULT: '#9aa3ad', dark: '#6b7580' },
        verdict: {
          pass: '#2a7246',
          'pass-bg': '#e3f1e8',
          near: '#8a5e00',
          'near-bg': '#fbf0d3',
          fail: '#b3261e',
          'fail-bg': '#fbe4e1',
        },
      },
      fontFamily: {
        sans: ['var(--font-sans)', 'system-ui', 'sans-serif'],
        mono: ['ui-monospace', 'SFMono-Regular', 'Menlo', 'monospace'],
      },
      borderRadius: { card: '10px' },
    },
  },
} satisfies Config;

import type { Config } from 'tailwindcss';

// Kettlefork's palette: warm malt paper, copper kettle, hop-bine green. Every colour is a CSS
// variable (set in app/globals.css) so the dark palette swaps in without new class names.
const config: Config = {
  content: ['./app/**/*.{ts,tsx,mdx}', './components/**/*.{ts,tsx}', './content/**/*.mdx'],
  darkMode: 'media',
  theme: {
    extend: {
      colors: {
        paper: 'rgb(var(--kf-paper) / <alpha-value>)',
        card: 'rgb(var(--kf-card) / <alpha-value>)',
        ink: 'rgb(var(--kf-ink) / <alpha-value>)',
        muted: 'rgb(var(--kf-muted) / <alpha-value>)',
        line: 'rgb(var(--kf-line) / <alpha-value>)',
        copper: 'rgb(var(--kf-copper) / <alpha-value>)',
        'copper-strong': 'rgb(var(--kf-copper-strong) / <alpha-value>)',
        bine: 'rgb(var(--kf-bine) / <alpha-value>)',
        danger: 'rgb(var(--kf-danger) / <alpha-value>)',
        caution: 'rgb(var(--kf-caution) / <alpha-value>)',
      },
      fontFamily: {
        serif: ['Literata', 'Georgia', 'serif'],
        sans: ['"IBM Plex Sans"', 'system-ui', 'sans-serif'],
      },
      maxWidth: { page: '72rem' },
    },
  },
};

export default config;

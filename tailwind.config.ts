import type { Config } from 'tailwindcss';

/**
 * Stillspan's own visual identity.
 *
 * Palette: warm "paper" grounds, "ink" text, a deep sea-green "tide" for actions and links, a rust "ember" for
 * cautions and highlights, and plain signal colours for errors and success. Every text/ground pair used in the
 * client meets WCAG AA contrast (4.5:1 for body text).
 *
 * Type: Work Sans on a major-third scale (×1.25 from a 16 px body), named by role rather than by size.
 */
export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        paper: { DEFAULT: '#f6f3ec', raised: '#fffdf8', sunk: '#ece7dc', line: '#d6cfc0' },
        ink: { DEFAULT: '#1b222c', soft: '#3b4553', muted: '#596373' },
        tide: {
          50: '#eef6f4',
          100: '#d7ebe7',
          200: '#a9d3ca',
          500: '#1f7a72',
          600: '#176a63',
          700: '#0f5751',
          800: '#0b433f',
          900: '#082f2c',
        },
        ember: { 50: '#fcf1e8', 100: '#f8e0cc', 500: '#c2621f', 600: '#a8521a', 700: '#8a4213' },
        signal: { error: '#a4262c', 'error-bg': '#fbe7e6', ok: '#2b6a3f', 'ok-bg': '#e4f2e7' },
      },
      fontFamily: {
        sans: ['"Work Sans"', 'system-ui', 'sans-serif'],
      },
      fontSize: {
        caption: ['0.8rem', { lineHeight: '1.15rem' }],
        small: ['0.875rem', { lineHeight: '1.3rem' }],
        body: ['1rem', { lineHeight: '1.55rem' }],
        lead: ['1.25rem', { lineHeight: '1.8rem' }],
        title: ['1.5625rem', { lineHeight: '2.1rem', letterSpacing: '-0.01em' }],
        headline: ['1.953rem', { lineHeight: '2.5rem', letterSpacing: '-0.015em' }],
        display: ['2.441rem', { lineHeight: '2.9rem', letterSpacing: '-0.02em' }],
      },
      borderRadius: { plate: '0.375rem', pill: '999px' },
      maxWidth: { sheet: '72rem' },
    },
  },
} satisfies Config;

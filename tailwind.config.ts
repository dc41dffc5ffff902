import type { Config } from 'tailwindcss';

/**
 * Colours are design tokens (CSS variables in app/globals.css); components use these names,
 * never raw palette classes, so the identity can change in one place.
 */
const config: Config = {
  content: ['./app/**/*.{ts,tsx}', './components/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        ink: 'var(--cf-ink)',
        muted: 'var(--cf-muted)',
        paper: 'var(--cf-paper)',
        panel: 'var(--cf-panel)',
        line: 'var(--cf-line)',
        accent: {
          DEFAULT: 'var(--cf-accent)',
          ink: 'var(--cf-accent-ink)',
          soft: 'var(--cf-accent-soft)',
        },
        rail: 'var(--cf-rail)',
        danger: { DEFAULT: 'var(--cf-danger)', soft: 'var(--cf-danger-soft)' },
        caution: { DEFAULT: 'var(--cf-caution)', soft: 'var(--cf-caution-soft)' },
        verdict: {
          holds: 'var(--cf-holds)',
          marginal: 'var(--cf-marginal)',
          fails: 'var(--cf-fails)',
          unprotected: 'var(--cf-unprotected)',
          incomplete: 'var(--cf-incomplete)',
        },
        circuit: {
          hazard: 'var(--cf-circuit-hazard)',
          sensitive: 'var(--cf-circuit-sensitive)',
          return: 'var(--cf-circuit-return)',
          earth: 'var(--cf-circuit-earth)',
          spare: 'var(--cf-circuit-spare)',
          barrier: 'var(--cf-circuit-barrier)',
        },
      },
      fontFamily: {
        sans: ['var(--font-plex)', 'var(--font-plex-greek)', 'system-ui', 'sans-serif'],
        mono: ['var(--font-plex-mono)', 'var(--font-plex-greek)', 'ui-monospace', 'monospace'],
      },
    },
  },
};

export default config;

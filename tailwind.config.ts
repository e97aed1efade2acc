import type { Config } from 'tailwindcss';

/**
 * Ampwarden's visual identity, defined once (../shared/design/product.md, "Visual identity"):
 * deep blue-grey ink for navigation and headings, warm off-white paper for content, a copper
 * accent for the brand and primary actions, and three result states that always come with a
 * word and an icon as well as the colour.
 */
const config: Config = {
  content: ['./app/**/*.{ts,tsx}', './components/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        ink: {
          50: '#f2f4f7',
          100: '#e1e6ec',
          200: '#c3ccd7',
          300: '#97a6b7',
          // Small text on white and paper: 5.16:1 on #ffffff, 4.83:1 on paper #faf7f1, 4.69:1 on ink-50
          // (WCAG 2.1 AA asks 4.5:1); was #6b7e94, 4.17:1 on white.
          400: '#5c6f85',
          500: '#4f6278',
          600: '#3d4e62',
          700: '#2f3d4f',
          800: '#233040',
          900: '#1a2431',
          950: '#111822',
          // Borders of form fields (WCAG 2.1 SC 1.4.11 non-text contrast, 3:1): 3.27:1 on white,
          // 3.06:1 on paper; ink-200 (1.62:1) stays for panel and table lines, which are not controls.
          edge: '#7f90a3',
        },
        paper: {
          DEFAULT: '#faf7f1',
          50: '#fdfcf9',
          100: '#faf7f1',
          200: '#f1ebdf',
          300: '#e4dac7',
        },
        copper: {
          300: '#e3a77c',
          400: '#d38a57',
          500: '#b8703d',
          600: '#9a5a2e',
          700: '#7b4624',
        },
        // Result states: within limit, margin under 10 %, over limit or runaway.
        within: { light: '#d7efec', DEFAULT: '#17776f', dark: '#0f544e' },
        tight: { light: '#f6e8c8', DEFAULT: '#a06b08', dark: '#74500a' },
        over: { light: '#f6dcd5', DEFAULT: '#a8402b', dark: '#7d2d1d' },
      },
      fontFamily: {
        sans: ['var(--font-plex-sans)', 'system-ui', 'sans-serif'],
        mono: ['var(--font-plex-mono)', 'ui-monospace', 'monospace'],
      },
      fontSize: {
        caption: ['0.75rem', { lineHeight: '1rem' }],
        body: ['0.875rem', { lineHeight: '1.35rem' }],
        lead: ['1.0625rem', { lineHeight: '1.6rem' }],
        title: ['1.375rem', { lineHeight: '1.8rem', fontWeight: '600' }],
        display: ['2.25rem', { lineHeight: '2.6rem', fontWeight: '600' }],
      },
      maxWidth: { sheet: '1440px' },
    },
  },
};

export default config;

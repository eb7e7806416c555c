import type { Config } from 'tailwindcss';

// Ohmstead's identity: warm copper accent on a cool slate base; IBM Plex shipped with the app.
const config: Config = {
  content: ['./app/**/*.{ts,tsx}', './components/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        copper: {
          50: '#fbf4ee', 100: '#f5e3d3', 200: '#eac3a2', 300: '#dd9c6c', 400: '#cf7c45',
          500: '#b8622c', 600: '#9a4f23', 700: '#7c3f1d', 800: '#5f311a', 900: '#462515',
        },
      },
      fontFamily: {
        sans: ['var(--font-plex-sans)', 'var(--font-plex-greek)', 'system-ui', 'sans-serif'],
        mono: ['var(--font-plex-mono)', 'var(--font-plex-greek)', 'ui-monospace', 'monospace'],
      },
    },
  },
};

export default config;

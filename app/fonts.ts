import localFont from 'next/font/local';

// IBM Plex ships inside @fontsource packages; next/font/local serves it from our own origin (no network).
export const plexSans = localFont({
  variable: '--font-plex-sans',
  display: 'swap',
  src: [
    { path: '../node_modules/@fontsource/ibm-plex-sans/files/ibm-plex-sans-latin-400-normal.woff2', weight: '400', style: 'normal' },
    { path: '../node_modules/@fontsource/ibm-plex-sans/files/ibm-plex-sans-latin-500-normal.woff2', weight: '500', style: 'normal' },
    { path: '../node_modules/@fontsource/ibm-plex-sans/files/ibm-plex-sans-latin-600-normal.woff2', weight: '600', style: 'normal' },
    { path: '../node_modules/@fontsource/ibm-plex-sans/files/ibm-plex-sans-latin-700-normal.woff2', weight: '700', style: 'normal' },
  ],
});

// Ω, µ-as-mu, ρ, θ, Δ: the Greek subset as a second family in the stack.
export const plexGreek = localFont({
  variable: '--font-plex-greek',
  display: 'swap',
  src: [
    { path: '../node_modules/@fontsource/ibm-plex-sans/files/ibm-plex-sans-greek-400-normal.woff2', weight: '400', style: 'normal' },
    { path: '../node_modules/@fontsource/ibm-plex-sans/files/ibm-plex-sans-greek-600-normal.woff2', weight: '600', style: 'normal' },
  ],
});

export const plexMono = localFont({
  variable: '--font-plex-mono',
  display: 'swap',
  src: [
    { path: '../node_modules/@fontsource/ibm-plex-mono/files/ibm-plex-mono-latin-400-normal.woff2', weight: '400', style: 'normal' },
    { path: '../node_modules/@fontsource/ibm-plex-mono/files/ibm-plex-mono-latin-500-normal.woff2', weight: '500', style: 'normal' },
  ],
});

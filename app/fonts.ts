import localFont from 'next/font/local';

// Shipped in fonts/ (IBM Plex, SIL Open Font License); nothing is fetched at build or run time.
export const plexSans = localFont({
  variable: '--font-plex',
  display: 'swap',
  src: [
    { path: '../fonts/ibm-plex-sans-latin-400-normal.woff2', weight: '400', style: 'normal' },
    { path: '../fonts/ibm-plex-sans-latin-500-normal.woff2', weight: '500', style: 'normal' },
    { path: '../fonts/ibm-plex-sans-latin-600-normal.woff2', weight: '600', style: 'normal' },
    { path: '../fonts/ibm-plex-sans-latin-700-normal.woff2', weight: '700', style: 'normal' },
  ],
});

// The latin subset has no Ω or µ-adjacent Greek letters; this family fills them in.
export const plexGreek = localFont({
  variable: '--font-plex-greek',
  display: 'swap',
  src: [
    { path: '../fonts/ibm-plex-sans-greek-400-normal.woff2', weight: '400', style: 'normal' },
    { path: '../fonts/ibm-plex-sans-greek-600-normal.woff2', weight: '600', style: 'normal' },
  ],
});

export const plexMono = localFont({
  variable: '--font-plex-mono',
  display: 'swap',
  src: [
    { path: '../fonts/ibm-plex-mono-latin-400-normal.woff2', weight: '400', style: 'normal' },
    { path: '../fonts/ibm-plex-mono-latin-500-normal.woff2', weight: '500', style: 'normal' },
  ],
});

import localFont from 'next/font/local';

// Shipped with the app from the installed package, so no page ever fetches a font from elsewhere.
export const brandFont = localFont({
  src: [
    { path: '../node_modules/@fontsource/source-sans-3/files/source-sans-3-latin-400-normal.woff2', weight: '400', style: 'normal' },
    { path: '../node_modules/@fontsource/source-sans-3/files/source-sans-3-latin-600-normal.woff2', weight: '600', style: 'normal' },
    { path: '../node_modules/@fontsource/source-sans-3/files/source-sans-3-latin-700-normal.woff2', weight: '700', style: 'normal' },
  ],
  variable: '--font-brand',
  display: 'swap',
});

import type { Metadata, Viewport } from 'next';
import localFont from 'next/font/local';
import { connection } from 'next/server';
import { cookies } from 'next/headers';
import { isSunlightTheme, SUNLIGHT_CLASS, THEME_COOKIE } from '@/lib/core/theme';
import './globals.css';

// Atkinson Hyperlegible for reading in glare; IBM Plex Mono for figures that must line up.
// Both shipped in app/fonts under the SIL Open Font License 1.1.
const body = localFont({
  src: [
    { path: './fonts/atkinson-hyperlegible-latin-400-normal.woff2', weight: '400', style: 'normal' },
    { path: './fonts/atkinson-hyperlegible-latin-700-normal.woff2', weight: '700', style: 'normal' },
  ],
  variable: '--font-body',
  display: 'swap',
});
const figures = localFont({
  src: [
    { path: './fonts/ibm-plex-mono-latin-400-normal.woff2', weight: '400', style: 'normal' },
    { path: './fonts/ibm-plex-mono-latin-600-normal.woff2', weight: '600', style: 'normal' },
  ],
  variable: '--font-figures',
  display: 'swap',
  // Not preloaded: on a slow link the body font (and the page's scripts) come first; figures show in the
  // fallback monospace for a moment and swap in. Both families are already cut to the Latin subset.
  preload: false,
});

export const metadata: Metadata = {
  title: { default: 'Boreline', template: '%s · Boreline' },
  description: 'Technical inspection and class parity for water-jet boat race meetings.',
  // The installed app (app/manifest.ts): iOS reads its own tags rather than the manifest. Its icon is
  // app/apple-icon.png (a file, like app/icon.svg: setting metadata.icons would drop the page's favicon link).
  appleWebApp: { capable: true, title: 'Boreline', statusBarStyle: 'default' },
};

export const viewport: Viewport = { width: 'device-width', initialScale: 1, themeColor: '#103a57' };

// Every page is rendered per request: its scripts carry the nonce of that response's CSP (proxy.ts),
// which a page prerendered at build time could not.
export default async function RootLayout({ children }: { children: React.ReactNode }) {
  await connection();
  // The "sunlight" theme's class is set here, in the HTML itself, so the first paint is already in it.
  const theme = isSunlightTheme((await cookies()).get(THEME_COOKIE)?.value) ? ` ${SUNLIGHT_CLASS}` : '';
  return (
    <html lang="en" className={`${body.variable} ${figures.variable}${theme}`}>
      <body>{children}</body>
    </html>
  );
}

// GET /manifest.webmanifest — the web app manifest (W3C Web App Manifest), served by Next.js's metadata
// file convention as application/manifest+json and linked from every page. It makes Boreline installable on
// a phone's home screen: the installed app opens at the signed-in home, and its shortcut opens the dock of
// the person's current meeting (/inspect/current decides which, per person, when it is opened). Icons are
// made from Boreline's mark by scripts/make-app-icons.mjs. Nothing here is personal: the file is the same
// for everyone.
import type { MetadataRoute } from 'next';

const THEME_COLOUR = '#103a57';
const PAPER_COLOUR = '#fbfaf6';

export default function manifest(): MetadataRoute.Manifest {
  return {
    id: '/home',
    name: 'Boreline — inspection at the dock',
    short_name: 'Boreline',
    description: 'Technical inspection and class parity for water-jet boat race meetings.',
    start_url: '/home',
    scope: '/',
    display: 'standalone',
    orientation: 'portrait',
    background_color: PAPER_COLOUR,
    theme_color: THEME_COLOUR,
    lang: 'en',
    categories: ['sports', 'utilities'],
    icons: [
      { src: '/icons/boreline-96.png', sizes: '96x96', type: 'image/png', purpose: 'any' },
      { src: '/icons/boreline-192.png', sizes: '192x192', type: 'image/png', purpose: 'any' },
      { src: '/icons/boreline-512.png', sizes: '512x512', type: 'image/png', purpose: 'any' },
      { src: '/icons/boreline-maskable-192.png', sizes: '192x192', type: 'image/png', purpose: 'maskable' },
      { src: '/icons/boreline-maskable-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
    ],
    shortcuts: [
      {
        name: 'Dock screen of my current meeting',
        short_name: 'Dock',
        description: 'Find a boat, record its inspection, see the records waiting on this phone.',
        url: '/inspect/current',
        icons: [{ src: '/icons/boreline-96.png', sizes: '96x96', type: 'image/png' }],
      },
    ],
  };
}

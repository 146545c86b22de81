'use client';

import { signOutTo } from './sign-out';

// A phone at the dock may be shared: signing out also empties the dock screen's offline caches
// (pages and board answers, which carry tag tokens). Records still waiting stay in IndexedDB and
// are only ever sent under the sign-in of the person who made them.
async function clearOfflineCaches() {
  if (typeof caches === 'undefined') return;
  const keys = await caches.keys();
  await Promise.all(keys.filter((k) => k.startsWith('boreline-inspect-')).map((k) => caches.delete(k)));
}

export function SignOutButton() {
  return (
    <button
      type="button"
      onClick={async () => {
        await clearOfflineCaches().catch(() => undefined);
        await signOutTo('/');
      }}
      className="btn min-h-touch border-2 border-white/60 bg-transparent px-3 text-white hover:bg-tide-700"
    >
      Sign out
    </button>
  );
}

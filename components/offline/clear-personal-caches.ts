// Signing out on a phone that may be shared: every cache the service worker fills goes (pages of the signed-in
// areas, the dock's board answers with tag tokens), and so do the copies of the hand-written worker before it.
// Left: the files that are the same for everyone — the precache and the content-hashed build files
// (boreline-precache-*, boreline-static), the fonts and the app's own images (never an upload: those come from
// /api/, which only boreline-data keeps). Records still waiting stay in IndexedDB and are only ever sent under the
// sign-in of the person who made them.
const SHARED_BUILD_FILES = /^boreline-(precache-|static$|fonts$|images$)/;

export async function clearPersonalCaches(): Promise<string[]> {
  if (typeof caches === 'undefined') return [];
  const gone = (await caches.keys()).filter((k) => k.startsWith('boreline-') && !SHARED_BUILD_FILES.test(k));
  await Promise.all(gone.map((k) => caches.delete(k)));
  if ('clearAppBadge' in navigator) await navigator.clearAppBadge().catch(() => undefined);
  return gone;
}

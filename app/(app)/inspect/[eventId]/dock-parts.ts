// The dock screen's parts that appear only once a boat is found (the boat card, the record form, the
// verdict) are loaded apart from the screen's first load (see dock-screen.tsx, which imports the same
// modules through next/dynamic, so both share one chunk each). loadDockParts fetches all three: at once
// when the screen is opened on a boat, or when the phone is idle, for the service worker to keep them
// before the signal goes.
export async function loadDockParts(): Promise<void> {
  await Promise.all([import('./boat-card-view'), import('./inspection-form'), import('./verdict-panel')]);
}

'use client';

import { signOutTo } from './sign-out';

// Signing out also empties what the service worker kept for this person (signOutTo, clearPersonalCaches).
export function SignOutButton() {
  return (
    <button
      type="button"
      onClick={() => void signOutTo('/')}
      className="btn min-h-touch border-2 border-white/60 bg-transparent px-3 text-white hover:bg-tide-700"
    >
      Sign out
    </button>
  );
}

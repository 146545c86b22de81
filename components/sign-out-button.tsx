'use client';

import { signOut } from 'next-auth/react';

export function SignOutButton() {
  return (
    <button type="button" onClick={() => signOut({ callbackUrl: '/' })} className="btn min-h-touch border-2 border-white/60 bg-transparent px-3 text-white hover:bg-tide-700">
      Sign out
    </button>
  );
}

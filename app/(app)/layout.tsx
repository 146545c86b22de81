import Link from '@/components/link';
import { redirect } from 'next/navigation';
import { getActor, allRolesOf } from '@/lib/server/auth/actor';
import { navFor } from '@/lib/core/navigation';
import { BrandMark } from '@/components/brand-mark';
import { SignOutButton } from '@/components/sign-out-button';
import { MainNav } from '@/components/main-nav';
import { ThemeSwitch } from '@/components/theme-switch';
import { AppWorker } from '@/components/offline/app-worker';

export const dynamic = 'force-dynamic';

// Coarse sign-in redirect for the signed-in area; each page and handler checks permissions itself.
export default async function AppLayout({ children }: { children: React.ReactNode }) {
  const actor = await getActor();
  if (!actor) redirect('/sign-in');
  const items = navFor(allRolesOf(actor));
  return (
    <div className="flex min-h-screen flex-col">
      <header className="bg-tide-900 text-white">
        <div className="mx-auto flex max-w-6xl flex-wrap items-center justify-between gap-3 px-4 py-3">
          <Link href="/home" className="flex items-center gap-2 no-underline">
            <BrandMark />
            <span className="text-xl font-bold text-white">Boreline</span>
          </Link>
          <div className="flex items-center gap-3 text-sm">
            <span className="hidden sm:inline" data-testid="signed-in-as">
              {actor.name ?? actor.email}
            </span>
            <ThemeSwitch tone="dark" />
            <SignOutButton />
          </div>
        </div>
        <MainNav items={items.map(({ href, label }) => ({ href, label }))} />
      </header>
      <AppWorker actorId={actor.id} />
      <main className="mx-auto w-full max-w-6xl flex-1 px-4 py-6">{children}</main>
    </div>
  );
}

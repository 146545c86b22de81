'use client';

import Link from '@/components/link';
import { usePathname } from 'next/navigation';

export type MainNavItem = { href: string; label: string };

/**
 * Every destination the role has, on every screen size: a two-column grid of large links on a
 * phone (nothing scrolls out of sight), the familiar strip from the small breakpoint up.
 */
export function MainNav({ items }: { items: MainNavItem[] }) {
  const pathname = usePathname() ?? '';
  const isCurrent = (href: string) => pathname === href || pathname.startsWith(`${href}/`);
  return (
    <nav aria-label="Main" className="mx-auto max-w-6xl px-2 pb-2 sm:pb-0">
      <ul className="grid grid-cols-2 gap-1 sm:flex sm:flex-wrap" data-testid="main-nav">
        {items.map((item) => {
          const current = isCurrent(item.href);
          return (
            <li key={item.href} className="min-w-0">
              {/* No prefetch (components/link.tsx): on one bar of signal a dozen background page fetches
                  compete with the page being used. */}
              <Link
                href={item.href}
                aria-current={current ? 'page' : undefined}
                className={`flex min-h-[44px] items-center rounded-lg px-3 font-bold sm:min-h-touch no-underline sm:whitespace-nowrap sm:rounded-b-none sm:rounded-t-lg sm:px-4 ${
                  current
                    ? 'bg-paper text-tide-900'
                    : 'bg-tide-700 text-white hover:bg-tide-500 sm:bg-transparent sm:hover:bg-tide-700'
                }`}
              >
                {item.label}
              </Link>
            </li>
          );
        })}
      </ul>
    </nav>
  );
}

import Link from '@/components/link';
import { BrandMark, BrandName } from '@/components/brand-mark';
import { ThemeSwitch } from '@/components/theme-switch';

export default function PublicLayout({ children }: { children: React.ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col">
      <header className="border-b border-paper-line bg-white">
        <div className="mx-auto flex max-w-5xl flex-wrap items-center justify-between gap-x-4 gap-y-2 px-4 py-3">
          <Link href="/" className="flex items-center gap-2 no-underline">
            <BrandMark />
            <BrandName />
          </Link>
          <nav className="flex items-center gap-2" aria-label="Site">
            <ThemeSwitch tone="light" />
            <Link href="/calculator" className="hidden font-bold sm:inline">
              Jet calculator
            </Link>
            {/* On a narrow phone the buttons move under the mark as a row rather than breaking their words. */}
            <Link href="/sign-in" className="btn-secondary whitespace-nowrap px-3 sm:px-5">
              Sign in
            </Link>
            <Link href="/sign-up" className="btn-primary whitespace-nowrap px-3 sm:px-5">
              Sign up
            </Link>
          </nav>
        </div>
      </header>
      <main className="mx-auto w-full max-w-5xl flex-1 px-4 py-8">{children}</main>
      <footer className="border-t border-paper-line px-4 py-6 text-center text-sm text-ink-mute">
        Boreline · inspection records and class parity for water-jet racing
      </footer>
    </div>
  );
}

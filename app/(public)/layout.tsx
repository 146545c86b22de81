import Link from 'next/link';
import { BrandMark, BrandName } from '@/components/brand-mark';
import { ThemeSwitch } from '@/components/theme-switch';

export default function PublicLayout({ children }: { children: React.ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col">
      <header className="border-b border-paper-line bg-white">
        <div className="mx-auto flex max-w-5xl items-center justify-between gap-4 px-4 py-3">
          <Link href="/" className="flex items-center gap-2 no-underline">
            <BrandMark />
            <BrandName />
          </Link>
          <nav className="flex items-center gap-2" aria-label="Site">
            <ThemeSwitch tone="light" />
            <Link href="/calculator" className="hidden font-bold sm:inline">
              Jet calculator
            </Link>
            <Link href="/sign-in" className="btn-secondary">
              Sign in
            </Link>
            <Link href="/sign-up" className="btn-primary">
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

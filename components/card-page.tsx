import Link from '@/components/link';
import { BrandMark, BrandName } from '@/components/brand-mark';

/**
 * A page that is one card under Boreline's mark (sign-in and the other account pages, a scanned
 * tag, an unknown address). `aside` sits beside the mark (the theme switch); extra attributes go on the card's <main>.
 */
export function CardPage({
  children,
  className = '',
  aside,
  ...main
}: React.ComponentProps<'main'> & { aside?: React.ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col items-center bg-paper-deep px-4 py-8">
      <div className={`mb-6 flex w-full max-w-md items-center gap-2 ${aside ? 'justify-between' : 'justify-center'}`}>
        <Link href="/" className="flex items-center gap-2 no-underline">
          <BrandMark className="h-10 w-10" />
          <BrandName />
        </Link>
        {aside}
      </div>
      <main className={`card w-full max-w-md ${className}`.trim()} {...main}>
        {children}
      </main>
    </div>
  );
}

import Link from 'next/link';
import { BrandMark, BrandName } from '@/components/brand-mark';

/**
 * A page that is one card under Boreline's mark (sign-in and the other account pages, a scanned
 * tag, an unknown address). Extra attributes go on the card's <main>.
 */
export function CardPage({ children, className = '', ...main }: React.ComponentProps<'main'>) {
  return (
    <div className="flex min-h-screen flex-col items-center bg-paper-deep px-4 py-8">
      <Link href="/" className="mb-6 flex items-center gap-2 no-underline">
        <BrandMark className="h-10 w-10" />
        <BrandName />
      </Link>
      <main className={`card w-full max-w-md ${className}`.trim()} {...main}>
        {children}
      </main>
    </div>
  );
}

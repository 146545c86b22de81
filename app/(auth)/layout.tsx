import Link from 'next/link';
import { BrandMark, BrandName } from '@/components/brand-mark';

export default function AuthLayout({ children }: { children: React.ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col items-center bg-paper-deep px-4 py-8">
      <Link href="/" className="mb-6 flex items-center gap-2 no-underline">
        <BrandMark className="h-10 w-10" />
        <BrandName />
      </Link>
      <main className="card w-full max-w-md">{children}</main>
    </div>
  );
}

import { CardPage } from '@/components/card-page';

export default function AuthLayout({ children }: { children: React.ReactNode }) {
  return <CardPage>{children}</CardPage>;
}

import { CardPage } from '@/components/card-page';
import { ThemeSwitch } from '@/components/theme-switch';

export default function AuthLayout({ children }: { children: React.ReactNode }) {
  return <CardPage aside={<ThemeSwitch tone="light" />}>{children}</CardPage>;
}

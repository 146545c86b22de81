import { cookies } from 'next/headers';
import { isSunlightTheme, THEME_COOKIE } from '@/lib/core/theme';
import { ThemeToggle } from './theme-toggle';

/** The sunlight toggle, starting in the state the theme cookie gives (the same one app/layout.tsx reads). */
export async function ThemeSwitch({ tone }: { tone: 'light' | 'dark' }) {
  const isSunlight = isSunlightTheme((await cookies()).get(THEME_COOKIE)?.value);
  return <ThemeToggle isSunlight={isSunlight} tone={tone} />;
}

'use client';

import { useState } from 'react';
import { SUNLIGHT_CLASS, THEME_COOKIE } from '@/lib/core/theme';

/**
 * Switches the high-contrast "sunlight" theme on and off. The choice lives in a cookie (one year, this
 * site only, not secret) so the server puts the class on <html> before the first paint of every later
 * page: no flash of the other theme, and no inline script for the Content Security Policy to allow.
 */
export function ThemeToggle({ isSunlight, tone }: { isSunlight: boolean; tone: 'light' | 'dark' }) {
  const [isOn, setOn] = useState(isSunlight);
  return (
    <button
      type="button"
      aria-pressed={isOn}
      data-testid="theme-toggle"
      title="High-contrast theme for reading in sunlight"
      className={`btn min-h-touch min-w-touch border-2 px-3 ${
        tone === 'dark'
          ? 'border-white/60 bg-transparent text-white hover:bg-tide-700 aria-pressed:bg-white aria-pressed:text-tide-900'
          : 'border-tide-600 bg-white text-tide-700 hover:bg-tide-50 aria-pressed:bg-tide-700 aria-pressed:text-white'
      }`}
      onClick={() => {
        const next = !isOn;
        setOn(next);
        document.documentElement.classList.toggle(SUNLIGHT_CLASS, next);
        document.cookie = `${THEME_COOKIE}=${next ? 'sunlight' : 'standard'}; Path=/; Max-Age=31536000; SameSite=Lax`;
      }}
    >
      <svg viewBox="0 0 24 24" className="h-5 w-5" aria-hidden="true">
        <circle cx="12" cy="12" r="5" fill="currentColor" />
        <path
          d="M12 1v3M12 20v3M1 12h3M20 12h3M4.2 4.2l2.1 2.1M17.7 17.7l2.1 2.1M4.2 19.8l2.1-2.1M17.7 6.3l2.1-2.1"
          stroke="currentColor"
          strokeWidth="2"
          strokeLinecap="round"
        />
      </svg>
      <span className="sr-only sm:not-sr-only">Sunlight</span>
    </button>
  );
}

// The user's choice of theme: the standard one or "sunlight", a high-contrast theme for reading
// a phone outdoors. Kept in a cookie so the server can set the class on <html> before first paint.
export const THEME_COOKIE = 'boreline-theme';
export const SUNLIGHT_CLASS = 'sunlight';

/** Whether a cookie value asks for the sunlight theme (anything else is the standard theme). */
export function isSunlightTheme(cookieValue: string | undefined): boolean {
  return cookieValue === 'sunlight';
}

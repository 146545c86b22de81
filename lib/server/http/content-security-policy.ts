// The Content Security Policy for pages: scripts only with this response's nonce (Next puts it on its
// own inline scripts when the request carries the policy) and what they load ('strict-dynamic',
// CSP Level 3); no 'unsafe-inline' for scripts. Styles keep 'unsafe-inline' (React style attributes).
// Framework-free: used by proxy.ts and by the tests.
import { serverEnv } from '../config/env';

export function pageCsp(nonce: string, dev = serverEnv().NODE_ENV === 'development'): string {
  return [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${dev ? " 'unsafe-eval'" : ''}`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self'",
    "connect-src 'self'",
    "media-src 'self' blob:",
    "worker-src 'self' blob:",
    "manifest-src 'self'",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join('; ');
}

/** A fresh nonce per response: 16 random bytes, base64 (CSP Level 3 asks for at least 128 bits). */
export function newNonce(): string {
  const bytes = new Uint8Array(16);
  crypto.getRandomValues(bytes);
  return btoa(String.fromCharCode(...bytes));
}

// Types for scripts/forwarding.mjs (plain JavaScript so node runs it without a build step).
import type { IncomingHttpHeaders } from 'node:http';
export function socketAddress(remoteAddress: string | undefined): string;
export function forwardHeaders<T extends IncomingHttpHeaders | Record<string, string | string[] | undefined>>(
  headers: T,
  remoteAddress: string | undefined,
  hops: number,
): T;
export function parseProxyHops(raw: string | undefined): number;
export function readListenHost(raw: string | undefined, fallback?: string): string;
export function isLoopbackHost(host: string): boolean;

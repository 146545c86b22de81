// Types for scripts/static-compression.mjs (plain JavaScript so node runs it without a build step).
import type { IncomingMessage, ServerResponse } from 'node:http';
export function acceptsBrotli(header: string | string[] | undefined): boolean;
export function createStaticCompression(options: { distDir: string; headers: [string, string][] }): {
  handle(req: IncomingMessage, res: ServerResponse): boolean;
  warm(): Promise<void>;
  size: number;
};

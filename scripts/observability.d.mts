// Types for scripts/observability.mjs (plain JavaScript so node runs it without a build step).
import type { Logger } from 'pino';
import type { Counter, Gauge, Histogram, Registry } from 'prom-client';
export type BorelineMetrics = {
  registry: Registry;
  httpDuration: Histogram<'method' | 'route' | 'status'>;
  inspectionRecords: Counter<'outcome'>;
  chainBroken: Gauge;
  chainLastCheck: Gauge;
  dbPool: Gauge<'state'>;
};
export function logger(): Logger;
export function metrics(): BorelineMetrics;
export function routeLabel(path: string): string;
export function logPath(url: string | undefined): string;
export function requestIdFor(incoming: string | string[] | undefined, trustProxy: boolean): string;

import 'server-only';
// The app's side of the structured log and the metrics (scripts/observability.mjs holds both, shared
// with the HTTP server through globalThis).
export { logger, metrics } from '../../scripts/observability.mjs';

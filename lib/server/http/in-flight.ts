import 'server-only';

// How many requests this app server is answering right now, counted by scripts/server.mjs (the custom
// server every deployment and the demo run); 0 under `next dev`, which has no such count. Background
// work that can wait (the mail outbox) waits while the server is busy, so it never competes with a
// scrutineer's record for the CPU.
export function requestsInFlight(): number {
  return (globalThis as { __borelineRequestsInFlight?: number }).__borelineRequestsInFlight ?? 0;
}

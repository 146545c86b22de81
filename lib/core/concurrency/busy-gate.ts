// Background work that can wait while a server answers requests, but not for ever. Each tick of a worker
// asks `shouldWait(inFlight, now)`: while requests are in flight it says wait, for at most `maxDeferMs`
// from the first tick that found the server busy; then it says go (and, once the server is idle, at once),
// and the clock starts again from the next busy tick.

export type BusyGate = {
  /** True: skip this tick. `inFlight` is the number of requests being answered, `now` a time in ms. */
  shouldWait(inFlight: number, now: number): boolean;
};

export function createBusyGate(maxDeferMs: () => number): BusyGate {
  let busySince: number | null = null;
  return {
    shouldWait(inFlight, now) {
      if (inFlight > 0) {
        busySince ??= now;
        if (now - busySince < maxDeferMs()) return true;
      }
      busySince = null;
      return false;
    },
  };
}

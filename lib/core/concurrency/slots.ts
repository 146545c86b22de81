// A fixed number of slots for work that must not all run at once; callers past the limit wait their turn, first
// come first served. A slot is given back however the work ends (value or error).

export type Slots = {
  /** Runs `work` once a slot is free; resolves or rejects as it does. */
  run<T>(work: () => Promise<T>): Promise<T>;
  /** Work running now and work waiting for a slot (for tests and metrics). */
  readonly running: number;
  readonly waiting: number;
};

export function createSlots(size: number): Slots {
  if (!Number.isInteger(size) || size < 1)
    throw new RangeError(`slots: size must be a whole number from 1 (got ${size})`);
  let running = 0;
  const queue: (() => void)[] = [];
  const release = () => {
    running--;
    const next = queue.shift();
    if (next) next();
  };
  return {
    async run<T>(work: () => Promise<T>): Promise<T> {
      if (running >= size) await new Promise<void>((resolve) => queue.push(resolve));
      running++;
      try {
        return await work();
      } finally {
        release();
      }
    },
    get running() {
      return running;
    },
    get waiting() {
      return queue.length;
    },
  };
}

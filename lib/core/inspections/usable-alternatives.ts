// Without a date library (calibration-state.ts has one): the dock's client code imports this.

/** The usable instruments among others of the same quantity: what the dock names instead of one it refuses. */
export function usableAlternatives<
  T extends { id: string; name: string; quantity: string; calibration: { usable: boolean } },
>(instruments: readonly T[], refused: T): T[] {
  return instruments.filter((i) => i.id !== refused.id && i.quantity === refused.quantity && i.calibration.usable);
}

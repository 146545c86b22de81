// A class's measured items: limits, key pattern and check-method words, without zod (the dock's client
// code imports these; the rules editor's schema is in measured-item-rules.ts).

/** At most this many items per class: a rules document stays readable and a dock form stays short. */
export const MAX_MEASURED_ITEMS = 20;
export const MAX_ITEM_READINGS = 12;
export const CHECK_METHODS = ['two_point', 'gauge', 'both'] as const;
export type CheckMethod = (typeof CHECK_METHODS)[number];

export const ITEM_KEY_PATTERN = /^[a-z][a-z0-9_]{1,39}$/;

/**
 * A value stored under an item's key, own properties only: a key such as "constructor" or "toString"
 * fits the pattern, and a plain lookup would find Object.prototype's function instead of nothing.
 */
export function ownValue<T>(byKey: Readonly<Record<string, T>> | null | undefined, key: string): T | undefined {
  return byKey && Object.hasOwn(byKey, key) ? byKey[key] : undefined;
}

/**
 * The difference between a two-point size and a gauge check, for the rules editor and the verdict.
 * ISO 14405-1:2016 distinguishes the two-point size (a local size between two opposite points)
 * from sizes taken over the whole feature, such as the maximum inscribed size a plug gauge tests.
 */
export const CHECK_METHOD_WORDS: Record<CheckMethod, string> = {
  two_point:
    'Two-point readings govern: every reading across the exit (a two-point size, ISO 14405-1:2016) must be within the limits.',
  gauge:
    'The go/no-go plug gauge governs: the largest round plug that fits the exit (its maximum inscribed size) is what is tested. Two-point readings are still recorded, but do not decide.',
  both: 'Both must pass: the plug gauge check and every two-point reading.',
};

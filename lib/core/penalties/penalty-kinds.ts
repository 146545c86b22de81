// The kinds of penalty a catalogue may hold, what each one's amount means, and how it touches the
// results. Words are Boreline's own; the kinds are the usual ones in motorsport codes (common practice,
// no single source). Framework-free: the forms, the server and the tests read it.
export const PENALTY_KINDS = [
  'time_added',
  'places_deducted',
  'points_deducted',
  'run_disqualification',
  'meeting_disqualification',
  'exclusion',
  'fine',
  'warning',
] as const;
export type PenaltyKind = (typeof PENALTY_KINDS)[number];

export const PENALTY_KIND_LABELS: Record<PenaltyKind, string> = {
  time_added: 'Time added',
  places_deducted: 'Places deducted',
  points_deducted: 'Points deducted (series standings)',
  run_disqualification: 'Disqualified from one run',
  meeting_disqualification: 'Disqualified from the meeting',
  exclusion: 'Excluded',
  fine: 'Fine',
  warning: 'Warning',
};

/** The unit of a kind's amount; null: the kind has no amount. */
export const PENALTY_AMOUNT_UNITS: Record<PenaltyKind, 's' | 'places' | 'points' | 'minor units' | null> = {
  time_added: 's',
  places_deducted: 'places',
  points_deducted: 'points',
  run_disqualification: null,
  meeting_disqualification: null,
  exclusion: null,
  fine: 'minor units',
  warning: null,
};

export const kindNeedsAmount = (kind: PenaltyKind) => PENALTY_AMOUNT_UNITS[kind] !== null;

/** Kinds that change the classified order of a class's results (the others are noted beside the row). */
export const ORDER_KINDS: readonly PenaltyKind[] = [
  'time_added',
  'places_deducted',
  'run_disqualification',
  'meeting_disqualification',
  'exclusion',
];

/** The caution kept on every penalty and appeal screen (the product's rules). */
export const GOVERNING_BODY_CAUTION =
  "Boreline records the officials' decisions; it does not make them. The governing body's rules, local regulations and the licensed officials decide penalties and appeals, and racing can hurt people: check every figure against the rules in force.";

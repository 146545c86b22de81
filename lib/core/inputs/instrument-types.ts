// The kinds of measuring instrument, without zod: the dock's client code imports these.
export const INSTRUMENT_TYPES = [
  'caliper',
  'bore_gauge',
  'micrometer',
  'plug_gauge',
  'tape',
  'scale',
  'thermometer',
  'other',
] as const;
export type InstrumentType = (typeof INSTRUMENT_TYPES)[number];
export const INSTRUMENT_TYPE_LABELS: Record<InstrumentType, string> = {
  caliper: 'Caliper',
  bore_gauge: 'Bore gauge',
  micrometer: 'Micrometer',
  plug_gauge: 'Plug gauge',
  tape: 'Tape',
  scale: 'Scale',
  thermometer: 'Thermometer',
  other: 'Other',
};

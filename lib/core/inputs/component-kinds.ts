import type { ComponentKind } from '@/models/boat-record';

// The kinds of component with identity, without zod: the dock's client code imports these.
export const COMPONENT_KIND_VALUES = ['engine', 'pump', 'impeller'] as const satisfies readonly ComponentKind[];
export const COMPONENT_KIND_LABELS: Record<ComponentKind, string> = {
  engine: 'Engine',
  pump: 'Jet pump',
  impeller: 'Impeller',
};

// What a class's rules actually limit (framework-free: used by publishing and by its tests).
// A version "limits nothing" when it sets no limit a scrutineer can check a boat against: no nozzle
// exit diameter limit (maximum or minimum), no power limit (minimum or maximum) and no minimum
// weight. Required safety items do not count: they are a checklist every class keeps (new classes
// start with all of them ticked), not a limit on the boat, so they cannot make empty rules publishable.
import type { ClassRules } from '@/lib/core/inputs/class-rules';

type RulesLike =
  | {
      nozzle?: Partial<ClassRules['nozzle']>;
      power?: Partial<ClassRules['power']>;
      weight?: Partial<ClassRules['weight']>;
    }
  | null
  | undefined;

const isSet = (v: unknown) => typeof v === 'number' && Number.isFinite(v);

/** The limits a rules document sets, in words ("maximum nozzle diameter", ...). */
export function limitsSet(rules: RulesLike): string[] {
  const out: string[] = [];
  if (isSet(rules?.nozzle?.maxMm)) out.push('maximum nozzle exit diameter');
  if (isSet(rules?.nozzle?.minMm)) out.push('minimum nozzle exit diameter');
  if (isSet(rules?.power?.minKw)) out.push('minimum power');
  if (isSet(rules?.power?.maxKw)) out.push('maximum power');
  if (isSet(rules?.weight?.minKg)) out.push('minimum weight');
  return out;
}

export const limitsNothing = (rules: RulesLike) => limitsSet(rules).length === 0;

export const limitsNothingMessage = (version: number) =>
  `Version ${version} limits nothing, so it cannot be published: it sets no nozzle exit diameter limit (maximum or minimum), no power limit (minimum or maximum) and no minimum weight. Safety items alone do not limit a boat. Set at least a nozzle diameter limit in the rules above and save the draft.`;

export const changeNoteRequiredMessage = (version: number) =>
  `Say what changed from version ${version - 1} and why: from version 2 on, every published version carries a change note.`;

// Words for the seal register, the same on the dock form, the verdict and the register screen.
// Plain TypeScript (no I/O), so the dock uses it offline.
import type { SealAction } from '../../../models/boat-record';

export type ComponentWords = { kind: string; maker: string; model: string; serialNumber: string };

/** “engine Marlo MX-6, serial 7731” — how a component is named in a seal's explanation. */
export function describeComponent(c: ComponentWords): string {
  const name = [c.maker, c.model]
    .map((x) => x.trim())
    .filter(Boolean)
    .join(' ');
  return `${c.kind}${name ? ` ${name}` : ''}, serial ${c.serialNumber}`;
}

export const SEAL_ACTION_WORDS: Record<SealAction, string> = {
  applied: 'Applied',
  intact: 'Found intact',
  broken: 'Found broken',
  missing: 'Found missing',
  removed: 'Removed',
};

export type SealStateWords = {
  lastAction: SealAction | null;
  component: string | null;
  boatName: string | null;
};

/** A seal's current state in words, from its latest event (none: unused). */
export function describeSealState(s: SealStateWords): string {
  const on = s.component ? ` ${s.component}${s.boatName ? ` of ${s.boatName}` : ''}` : '';
  switch (s.lastAction) {
    case null:
      return 'Unused';
    case 'applied':
      return `Applied to${on || ' a component'}`;
    case 'intact':
      return `Intact at last check (${on.trim() || 'component unknown'})`;
    case 'broken':
      return `Broken (${on.trim() || 'component unknown'})`;
    case 'missing':
      return `Missing (${on.trim() || 'component unknown'})`;
    case 'removed':
      return 'Removed';
  }
}

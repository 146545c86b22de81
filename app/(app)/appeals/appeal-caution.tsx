import { SafetyNote } from '@/components/safety-note';
import { GOVERNING_BODY_CAUTION } from '@/lib/core/penalties/penalty-kinds';

/** The caution on every appeal screen: the governing body's rules and its officials decide. */
export function AppealCaution() {
  return (
    <div className="space-y-2" data-testid="governing-body-caution">
      <SafetyNote />
      <p className="text-sm text-ink-soft">{GOVERNING_BODY_CAUTION}</p>
    </div>
  );
}

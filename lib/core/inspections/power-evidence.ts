// The power evidence an inspection recorded, in words for the verdict and the boat card.
import { POWER_EVIDENCE_KIND_WORDS, type PowerEvidenceKind } from '../inputs/inspection-terms';

export type RecordedPowerEvidence = {
  evidenceSeen?: boolean;
  evidenceKind?: PowerEvidenceKind | null;
  dynoDocument?: { id: string; fileName: string } | null;
};

/** “Sealed dyno sheet (dyno-2027.pdf)”; a record from before the kind was asked says only whether evidence was seen. */
export function describePowerEvidence(p: RecordedPowerEvidence | null | undefined): string {
  if (!p) return 'Not recorded';
  if (p.evidenceKind) {
    const doc =
      p.evidenceKind === 'dyno_sheet'
        ? p.dynoDocument
          ? ` (${p.dynoDocument.fileName})`
          : ' (paper, not uploaded)'
        : '';
    return `${POWER_EVIDENCE_KIND_WORDS[p.evidenceKind]}${doc}`;
  }
  return p.evidenceSeen ? 'Evidence seen (kind not recorded)' : 'No evidence seen';
}

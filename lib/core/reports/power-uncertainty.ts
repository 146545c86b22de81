// The uncertainty of a boat's shaft power follows the evidence the scrutineer saw. Power dominates
// thrust at speed (at fixed power T0 ∝ P^(2/3), and more so as speed rises), so one figure for every
// boat whatever the evidence overstates how well a declaration-only boat is known.
//
// Expanded uncertainties (k = 2) as a share of the power, by evidence: common practice, no source
// (a judgement: a sealed dyno run repeats to a few per cent; a maker's rating covers production
// spread and installation losses; a bare declaration is worth little more than a band). The class's
// own power uncertainty stays the floor, so a class that set a larger one keeps it.

export const POWER_EVIDENCE_SHARE = {
  dyno_sheet: 0.03,
  maker_rating: 0.08,
  declaration_only: 0.15,
} as const;

export type PowerEvidence = keyof typeof POWER_EVIDENCE_SHARE;

export const POWER_EVIDENCE_LABELS: Record<PowerEvidence, string> = {
  dyno_sheet: 'sealed dyno sheet',
  maker_rating: 'maker’s rating',
  declaration_only: 'declaration only',
};

/** The evidence a record names; an older record that says only "evidence seen" counts as a maker's rating. */
export function evidenceOf(kind: PowerEvidence | null | undefined, evidenceSeen: boolean): PowerEvidence {
  return kind ?? (evidenceSeen ? 'maker_rating' : 'declaration_only');
}

export type PowerEvidenceShares = Record<PowerEvidence, number>;

/**
 * Expanded uncertainty of the power (kW, k = 2): the larger of the class's figure and the evidence's
 * share, the class's own shares where its rules set them, else the common-practice ones above.
 */
export function powerExpandedUncertaintyKw(
  powerKw: number,
  evidence: PowerEvidence,
  classDefaultKw: number,
  classShares?: PowerEvidenceShares | null,
): number {
  return Math.max(classDefaultKw, (classShares ?? POWER_EVIDENCE_SHARE)[evidence] * powerKw);
}

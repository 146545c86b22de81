// The stored documents of a published parity report (parity_reports.inputs and .results): frozen
// once published, so their shape is part of the record. The names the app uses
// (lib/core/reports/parity-figures.ts, lib/core/engine/parity.ts) are checked against these in
// lib/core/stored-shapes.ts, so typecheck fails when either side drifts.

export type StoredReportBoatInput = {
  entryId: string;
  raceNumber: number;
  boatName: string;
  powerKw: number;
  uPowerKw: number;
  powerSource: 'declared' | 'verified';
  nozzleDiameterMm: number;
  uNozzleDiameterMm: number;
  inspectionId: string | null;
  inspectedAt: string | null;
  /** Set when the declaration changed after the inspection these figures come from: what changed. */
  awaitingReinspection?: string | null;
};

export type StoredReportInputs = {
  eventName: string;
  classCode: string;
  className: string;
  ruleVersion: { id: string; version: number };
  assumptions: {
    pumpEfficiency: number;
    nozzleLossCoefficient: number;
    inletLossCoefficient: number;
    wakeFraction: number;
    referenceSpeedsMs: number[];
  };
  density: { densityKgM3: number; description: string };
  boats: StoredReportBoatInput[];
  excluded: { entryId: string; raceNumber: number; boatName: string; reason: string }[];
  computedAt: string;
};

export type StoredParityBoatResult = {
  id: string;
  label: string;
  powerKw: number;
  nozzleDiameterMm: number;
  isReferenceBoat: boolean;
  staticThrustN: number;
  uStaticThrustN: number;
  staticJetVelocityMs: number;
  uStaticJetVelocityMs: number;
  thrustAtReferenceSpeeds: { speedMs: number; thrustN: number; uThrustN: number; isThrustPositive: boolean }[];
  deviationFromMedianN: number;
  deviationFromMedianPercent: number;
  uDeviationFromMedianN: number;
  uDeviationFromMedianPercent: number;
  crossoverWithMedianMs: number | null;
  uCrossoverWithMedianMs: number | null;
  equalisingNozzleDiameterMm: number;
  uEqualisingNozzleDiameterMm: number;
  /** Absent in reports published before it. */
  rangeEqualising?: {
    nozzleDiameterMm: number;
    rmsDeviationPercent: number;
    worstDeviationPercent: number;
    staticWorstDeviationPercent: number;
    deviations: {
      speedMs: number;
      medianThrustN: number;
      staticEqualisedPercent: number;
      rangeEqualisedPercent: number;
    }[];
  } | null;
};

export type StoredParity = {
  summary: {
    boatCount: number;
    medianStaticThrustN: number;
    minStaticThrustN: number;
    maxStaticThrustN: number;
    meanStaticThrustN: number;
    sampleStandardDeviationN: number | null;
    maxMinRatio: number;
    spreadPercent: number;
    coefficientOfVariationPercent: number | null;
  };
  referenceSetup: {
    kind: 'boat' | 'synthetic';
    boatId: string | null;
    powerKw: number;
    nozzleDiameterMm: number;
    staticThrustN: number;
  };
  boats: StoredParityBoatResult[];
};

type StoredClassFigure = { value: number; u: number };

export type StoredReportResults = {
  parity: StoredParity | null;
  classFigures: {
    medianStaticThrustN: StoredClassFigure;
    minStaticThrustN: StoredClassFigure;
    maxStaticThrustN: StoredClassFigure;
    spreadPercent: StoredClassFigure;
    jetVelocityMinMs: number;
    jetVelocityMedianMs: number;
    jetVelocityMaxMs: number;
    jetVelocitySpreadPercent: number;
  } | null;
  curves: { speedsMs: number[]; reference: number[]; byEntry: Record<string, number[]> } | null;
};

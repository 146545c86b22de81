// The declared engine and pump data of a boat (boats.declared_performance and
// boat_declaration_versions.declared_performance). The input schema is lib/core/inputs/boat-performance.ts;
// lib/core/stored-shapes.ts fails typecheck when the two drift apart. Figures in rpm, kW, mm, m, °C.

export const STORED_ENGINE_CURVE_SHAPES = ['flat', 'spark_ignition', 'diesel'] as const;

export type StoredEngineCurvePoint = { rpm: number; powerKw: number };
export type StoredPumpCurvePoint = { flowCoefficient: number; headCoefficient: number; efficiency: number };

export type StoredDeclaredEngine =
  | { kind: 'points'; curve: StoredEngineCurvePoint[]; limiterRpm?: number }
  | {
      kind: 'rated';
      ratedPowerKw: number;
      ratedRpm: number;
      shape: (typeof STORED_ENGINE_CURVE_SHAPES)[number];
      limiterRpm?: number;
    };

export type StoredDeclaredPump =
  | { kind: 'points'; impellerDiameterMm: number; curve: StoredPumpCurvePoint[] }
  | {
      kind: 'catalogue';
      catalogueEntryId: string;
      /** A copy of the catalogue entry as it was when declared (a later entry never rewrites it). */
      maker: string;
      model: string;
      trimCode: string;
      impellerDiameterMm: number;
      curve: StoredPumpCurvePoint[];
    };

export type StoredDeclaredSuction = {
  inletDepthM: number;
  waterTemperatureC?: number;
  ambientPressurePa?: number;
  suctionSpecificSpeed?: number;
  requiredNpshAtRated?: { npshM: number; rpm: number; flowM3s: number };
};

export type StoredBoatPerformance = {
  engine: StoredDeclaredEngine | null;
  pump: StoredDeclaredPump | null;
  suction: StoredDeclaredSuction | null;
};

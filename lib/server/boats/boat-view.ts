import 'server-only';
import type { Boat, BoatDocument } from '@/models';
import type { BoatDeclaration } from '@/lib/core/inputs/boats';
import type { StoredBoatPerformance } from '@/lib/core/boats/declared-performance';
import { getDb } from '@/lib/server/db';
import { AppError } from '@/lib/core/errors';
import { parseId } from '@/lib/server/http/ids';
import type { Actor } from '@/lib/server/auth/actor';

// Plain objects for screens and handlers (never Sequelize instances), and the one owner lookup.

export type BoatView = BoatDeclaration & {
  id: string;
  /** Declared engine curve, pump characteristic and suction data (null: none). */
  declaredPerformance: StoredBoatPerformance | null;
  createdAt: string;
  updatedAt: string;
};

export type BoatDocumentView = {
  id: string;
  kind: string;
  fileName: string;
  contentType: string;
  sizeBytes: number;
  sha256: string;
  createdAt: string;
};

export const toBoatView = (b: Boat): BoatView => ({
  id: b.id,
  name: b.name,
  hullNumber: b.hullNumber,
  hullDescription: b.hullDescription,
  pumpDescription: b.pumpDescription,
  impellerDescription: b.impellerDescription,
  declaredNozzleMm: b.declaredNozzleMm,
  declaredNozzleToleranceMm: b.declaredNozzleToleranceMm,
  engineDescription: b.engineDescription,
  declaredPowerKw: b.declaredPowerKw,
  powerEvidence: b.powerEvidence,
  displacementL: b.displacementL ?? null,
  declaredWeightKg: b.declaredWeightKg ?? null,
  declaredPerformance: b.declaredPerformance ?? null,
  createdAt: b.createdAt.toISOString(),
  updatedAt: b.updatedAt.toISOString(),
});

export const toDocumentView = (d: BoatDocument): BoatDocumentView => ({
  id: d.id,
  kind: d.kind,
  fileName: d.fileName,
  contentType: d.contentType,
  sizeBytes: d.sizeBytes,
  sha256: d.sha256,
  createdAt: d.createdAt.toISOString(),
});

const notFound = () => new AppError('not_found', 404, 'No such boat among yours.');

/**
 * The actor's own boat, the ownership check inside the query. Another person's boat answers
 * exactly like a missing one (404), so ids reveal nothing.
 */
export async function findOwnBoat(actor: Actor, boatId: string): Promise<Boat> {
  let id: string;
  try {
    id = parseId(boatId, 'boat');
  } catch {
    throw notFound();
  }
  const boat = await getDb().models.Boat.findOne({ where: { id, ownerId: actor.id } });
  if (!boat) throw notFound();
  return boat;
}

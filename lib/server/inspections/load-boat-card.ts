import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import type { Actor } from '@/lib/server/auth/actor';
import { findRulesInForce } from '@/lib/server/classes/rule-versions';
import { checkDeclaration, type DeclarationCheck } from '@/lib/core/entries/check-declaration';
import type { ClassRules } from '@/lib/core/inputs/class-rules';
import { currentInspectionCte, loadInspectionViews, type InspectionView } from './inspection-view';
import { listReinspectionViews, type ReinspectionView } from './reinspection-view';
import { heldPartsJsonSql, type HeldPart } from '@/lib/server/custody/custody-view';
import type { DockEntryChoice } from './choose-dock-entry';
import { loadBoatComponentChoices, loadBoatSeals, type BoatSeal } from '@/lib/server/seals/boat-seals';

// What a scrutineer sees at the dock before measuring: the boat, its declaration against the rules
// in force now, its entry and payment, every earlier record at this meeting and open tasks.
export type BoatCard = {
  event: { id: string; name: string };
  entry: {
    id: string;
    raceNumber: number;
    status: string;
    isPaid: boolean;
    paidAt: string | null;
    inspectionResult: string | null;
  };
  boat: {
    id: string;
    name: string;
    hullNumber: string;
    hullDescription: string;
    pumpDescription: string;
    impellerDescription: string;
    engineDescription: string;
    declaredNozzleMm: number;
    declaredNozzleToleranceMm: number;
    declaredPowerKw: number;
    powerEvidence: string;
    declaredWeightKg: number | null;
    /** The declaration version shown (the newest); a record made from this card says it checked that one. */
    declarationVersion: number;
  };
  raceClass: { id: string; code: string; name: string };
  ruleVersion: { id: string; version: number; effectiveFrom: string | null; rules: ClassRules } | null;
  declaration: DeclarationCheck | null;
  inspections: InspectionView[];
  currentInspectionId: string | null;
  openReinspections: ReinspectionView[];
  /** Parts of this boat the officials hold now (taken into custody, not released). */
  partsHeld: HeldPart[];
  /** The register's seals on the boat's components now (to be checked: intact, broken or missing). */
  seals: BoatSeal[];
  /** The boat's components now, for applying a seal. */
  components: { id: string; label: string }[];
  /** The boat's uploaded documents, for naming the dyno sheet seen. */
  documents: { id: string; kind: string; fileName: string }[];
  /** The person asking entered or owns this boat: they may look, never record. */
  isOwnBoat: boolean;
  /** The boat's other live entries here (a meeting may allow several classes per boat): each is inspected apart. */
  otherEntries: DockEntryChoice[];
};

/** The card for one entry of the event (the caller has checked permission and that the entry is there). */
export async function loadBoatCard(
  actor: Actor,
  eventId: string,
  entryId: string,
  otherEntries: DockEntryChoice[],
): Promise<BoatCard> {
  const { models, sequelize } = getDb();
  const entry = await models.Entry.findOne({ where: { id: entryId, eventId } });
  if (!entry) throw new Error(`entry ${entryId} not at event ${eventId}`);
  const [
    boat,
    raceClass,
    event,
    ruleVersion,
    inspections,
    openReinspections,
    current,
    partsHeld,
    seals,
    components,
    documents,
    declarationVersion,
  ] = await Promise.all([
    models.Boat.findByPk(entry.boatId),
    models.RaceClass.findByPk(entry.classId),
    models.Event.findByPk(eventId, { attributes: ['id', 'name'] }),
    findRulesInForce(entry.classId, new Date()),
    loadInspectionViews('i.entry_id = :entryId', { entryId }),
    listReinspectionViews({ eventId, entryId, openOnly: true }),
    sequelize.query<{ id: string }>(`with ${currentInspectionCte('entry')} select id from current_inspection`, {
      replacements: { entryId },
      type: QueryTypes.SELECT,
    }),
    sequelize.query<{ parts: HeldPart[] | null }>(`select ${heldPartsJsonSql(':entryId')} as parts`, {
      replacements: { entryId },
      type: QueryTypes.SELECT,
    }),
    loadBoatSeals(entry.boatId),
    loadBoatComponentChoices(entry.boatId),
    models.BoatDocument.findAll({
      where: { boatId: entry.boatId },
      attributes: ['id', 'kind', 'fileName'],
      order: [['createdAt', 'DESC']],
    }),
    models.BoatDeclarationVersion.max('version', { where: { boatId: entry.boatId } }),
  ]);
  if (!boat || !raceClass || !event) throw new Error(`entry ${entryId} has a missing boat, class or event`);
  return {
    event: { id: event.id, name: event.name },
    entry: {
      id: entry.id,
      raceNumber: entry.raceNumber,
      status: entry.status,
      isPaid: entry.paidAt != null && entry.refundedAt == null,
      paidAt: entry.paidAt ? entry.paidAt.toISOString() : null,
      inspectionResult: entry.inspectionResult ?? null,
    },
    boat: {
      id: boat.id,
      name: boat.name,
      hullNumber: boat.hullNumber,
      hullDescription: boat.hullDescription,
      pumpDescription: boat.pumpDescription,
      impellerDescription: boat.impellerDescription,
      engineDescription: boat.engineDescription,
      declaredNozzleMm: boat.declaredNozzleMm,
      declaredNozzleToleranceMm: boat.declaredNozzleToleranceMm,
      declaredPowerKw: boat.declaredPowerKw,
      powerEvidence: boat.powerEvidence,
      declaredWeightKg: boat.declaredWeightKg ?? null,
      declarationVersion: Number(declarationVersion),
    },
    raceClass: { id: raceClass.id, code: raceClass.code, name: raceClass.name },
    ruleVersion: ruleVersion
      ? {
          id: ruleVersion.id,
          version: ruleVersion.version,
          effectiveFrom: ruleVersion.effectiveFrom,
          rules: ruleVersion.rules,
        }
      : null,
    declaration: ruleVersion
      ? checkDeclaration(
          {
            declaredNozzleMm: boat.declaredNozzleMm,
            declaredNozzleToleranceMm: boat.declaredNozzleToleranceMm,
            declaredPowerKw: boat.declaredPowerKw,
            declaredWeightKg: boat.declaredWeightKg ?? null,
          },
          ruleVersion.rules,
        )
      : null,
    inspections,
    currentInspectionId: current[0]?.id ?? null,
    openReinspections,
    partsHeld: partsHeld[0]?.parts ?? [],
    seals,
    components,
    documents: documents.map((d) => ({ id: d.id, kind: d.kind, fileName: d.fileName })),
    isOwnBoat: entry.entrantId === actor.id || boat.ownerId === actor.id,
    otherEntries,
  };
}

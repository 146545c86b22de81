import 'server-only';
import { buildEntryCrewView, loadEntryContext } from '@/lib/server/crew/crew-data';
import { randomUUID } from 'node:crypto';
import { z } from 'zod';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { preparedPipeline, preparedQuery } from '@/lib/server/db/prepared-query';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError, fieldError } from '@/lib/core/errors';
import { outboxInsertSql, outboxRows, type QueuedMail } from '@/lib/server/mail/outbox';
import { pickDeclaration, type DeclarationFields } from '@/lib/core/boats/declaration-changes';
import { flagInspectedEntries } from '@/lib/server/boats/flag-declaration-change';
import { mailChiefScrutineers } from '@/lib/server/boats/mail-declaration-change';
import { RecordInspectionInput } from '@/lib/core/inputs/inspections';
import {
  decideInspection,
  describeScope,
  scopeFromRequestedChecks,
  VERDICT_WORDS,
  type CheckArea,
  type GearOnDay,
  type InstrumentFigures,
  type InspectionDecision,
} from '../../core/inspections/decide-inspection';
import { buildInspectionRecord } from '../../core/inspections/inspection-record';
import { toInstrumentFigures, withCertificateFigures } from '../../core/inspections/instrument-figures';
import { calibrationState } from '../../core/inspections/calibration-state';
import { eventTimeZone, loadCalibrationFacts } from './instrument-calibration';
import { resolveItemInstruments } from './item-instruments';
import { currentInspectionCte, loadInspectionViews, type InspectionView } from './inspection-view';
import { publishedRules } from '@/lib/server/classes/published-rules';
import { planInspectionSeals, writeInspectionSealEvents } from '@/lib/server/seals/inspection-seals';

// Built once, not per record (a zod schema costs its construction on every call otherwise).
const UUID = z.uuid();

type EntryRow = {
  id: string;
  entrantId: string;
  raceNumber: number;
  status: string;
  classId: string;
  boatId: string;
  ownerId: string;
  boatName: string;
  boatDeclaredKw: number;
  boatPowerEvidence: string;
  className: string;
  eventName: string;
  entrantEmail: string;
  /** The boat's newest declaration version (what a dock showing the boat now shows), and its id. */
  latestDeclarationVersion: number;
  latestDeclarationVersionId: string | null;
  /** The class's published rule versions, newest first; effectiveFromMs rounded up to the millisecond (their rules: publishedRules). */
  publishedVersions: { id: string; version: number; effectiveFromMs: number }[] | null;
  /** Dated safety gear declared on the entry (none: no gear line in the verdict, and no gear read). */
  gearItems: number;
};

async function findInstrument(
  eventId: string,
  id: string | null,
  quantity: 'length' | 'mass',
  field: string,
  measuredAt: Date,
): Promise<InstrumentFigures | null> {
  if (!id) return null;
  const i = await getDb().models.Instrument.findOne({ where: { id, eventId, retiredAt: null } });
  if (!i) throw fieldError(field, 'This instrument is not on this meeting’s list.');
  if (i.quantity !== quantity)
    throw fieldError(
      field,
      quantity === 'length'
        ? `${i.name} is a scale: choose a length instrument.`
        : `${i.name} measures length: choose a scale.`,
    );
  // Its calibration at the moment the boat was measured (a record that waited offline is judged by
  // its capture time, so one taken before the due date or before a failed check still counts).
  const [facts, timeZone] = await Promise.all([loadCalibrationFacts([i.id]), eventTimeZone(eventId)]);
  const f = facts.get(i.id) ?? { certificates: [], checks: [] };
  const calibration = calibrationState(f.certificates, f.checks, measuredAt, timeZone ?? 'UTC');
  if (!calibration.usable)
    throw fieldError(field, `${i.name} cannot be used: ${calibration.reason}. Choose another instrument.`, 409);
  return withCertificateFigures(toInstrumentFigures(i), calibration.certificate);
}

const alreadyCorrected = () =>
  new AppError(
    'already_corrected',
    409,
    'This record was already corrected: correct the correction (the newest record in its history) instead.',
  );

/** The stored record for a key; a key used at another meeting is a conflict, never a leak. */
async function findByKey(eventId: string, key: string): Promise<InspectionView | null> {
  const [found] = await loadInspectionViews('i.idempotency_key = :key', { key });
  if (found && found.eventId !== eventId)
    throw new AppError(
      'key_in_use',
      409,
      'This record key was already used for another meeting’s record; make a new record.',
    );
  return found ?? null;
}

// The entry with its boat, class, meeting and entrant in one round trip (this runs for every record
// sent), and whether the record's key is already stored, so a new record costs no extra query.
const GEAR_FINDINGS = ['gear_expired', 'gear_not_presented', 'gear_not_as_declared'];

async function gearOnDay(entryId: string, at: Date): Promise<GearOnDay | null> {
  const context = await loadEntryContext(entryId);
  if (!context) return null;
  const view = await buildEntryCrewView(context, at);
  return {
    day: view.assessment.day,
    items: view.assessment.gear.length,
    findings: view.assessment.findings
      .filter((f) => GEAR_FINDINGS.includes(f.code))
      .map((f) => ({ code: f.code, text: f.text })),
  };
}

async function loadEntry(eventId: string, entryId: string, key: string | null) {
  // Prepared: this runs for every record, and PostgreSQL planned it for longer than it ran.
  const [row] = await preparedQuery<EntryRow & { keyEventId: string | null }>(
    'record-inspection:entry',
    `select e.id, e.entrant_id as "entrantId", e.race_number as "raceNumber", e.status, e.class_id as "classId", e.boat_id as "boatId",
            b.owner_id as "ownerId", b.name as "boatName", b.declared_power_kw as "boatDeclaredKw", b.power_evidence as "boatPowerEvidence",
            c.name as "className", ev.name as "eventName", u.email as "entrantEmail",
            (select count(*)::int from entry_gear_items g where g.entry_id = e.id) as "gearItems",
            (select i.event_id from inspections i where i.idempotency_key = :key) as "keyEventId",
            latest.version as "latestDeclarationVersion", latest.id as "latestDeclarationVersionId",
            (select json_agg(json_build_object('id', v.id, 'version', v.version,
                                               'effectiveFromMs', ceil(extract(epoch from v.effective_from) * 1000))
                             order by v.effective_from desc, v.version desc)
               from class_rule_versions v where v.class_id = e.class_id and v.status = 'published' and v.effective_from is not null) as "publishedVersions"
       from entries e join boats b on b.id = e.boat_id join race_classes c on c.id = e.class_id join events ev on ev.id = e.event_id
            join users u on u.id = e.entrant_id
            left join lateral (select d.id, d.version from boat_declaration_versions d where d.boat_id = e.boat_id
                                order by d.version desc limit 1) latest on true
      where e.id = :entryId and e.event_id = :eventId`,
    { entryId, eventId, key },
  );
  return row as (EntryRow & { keyEventId: string | null }) | undefined;
}

// The columns of a new record and their values (replacements named as in recordInspection's row), the
// entry's row lock taken in the same statement as `locked`.
const INSERT_COLUMNS = `event_id, entry_id, boat_id, class_id, rule_version_id, kind, recorded_by_id, device, idempotency_key,
  captured_at, supersedes_id, correction_reason, reinspection_id, measurements, results, overall_result, notes`;
const INSERT_VALUES = `:eventId, locked.id, :boatId, :classId, :ruleVersionId, :kind, :recordedById, :device, :idempotencyKey,
  :capturedAt, :supersedesId, :correctionReason, :reinspectionId, :measurements::jsonb, :results::jsonb, :overall, :notes`;

// A task is answered only by a boat measured after the task was opened: a record captured before the
// damage or the new declaration (or a correction restating an earlier measurement) cannot settle it. Five
// minutes allow for a phone's clock running behind the server's. :measuredAt is the record's capture time,
// or for a correction the capture time of the record it restates.
const MEASURED_AFTER_TASK = `created_at <= cast(:measuredAt as timestamptz) + interval '5 minutes'`;

// A record of the version a declaration-change task asked about (or later) settles that task.
const settleAskedSql = `update reinspections r set done_at = now(), inspection_id = :id, updated_at = now()
     from boat_declaration_versions asked, boat_declaration_versions seen
    where r.entry_id = :entryId and r.done_at is null and asked.id = r.declaration_version_id
      and seen.id = :declarationVersionId and asked.boat_id = seen.boat_id and asked.version <= seen.version
      and r.${MEASURED_AFTER_TASK}`;

type NewRecordRow = Record<string, unknown> & { entryId: string; boatId: string; reinspectionId: string | null };
type Inserted = { id: string; receivedAt: Date; declarationVersionId: string };

// A new record of the boat's latest declaration, with no seal events: the insert takes the entry's row lock
// and inserts unless the declaration moved on or the key is stored.
const ONE_TRIP_INSERT = `with locked as (select id from entries where id = :entryId for update)
     insert into inspections (id, ${INSERT_COLUMNS}, declaration_version_id)
     select :id, ${INSERT_VALUES}, :declarationVersionId
       from locked
      where not exists (select 1 from boat_declaration_versions d where d.boat_id = :boatId and d.version > :shownVersion)
     on conflict (idempotency_key) do nothing
     returning id, received_at as "receivedAt", declaration_version_id as "declarationVersionId"`;

// What follows a record (as in the full transaction of recordInspection), on a new snapshot that holds the
// insert and every record committed before the entry's lock was granted; nothing when the insert inserted
// nothing (a stored key, or a declaration that moved on), since it is sent before the insert is answered.
const ONE_TRIP_FOLLOW_UP = `with ${currentInspectionCte('entry')},
     inserted as (select 1 from inspections where id = :id),
     entry_result as (
       update entries set inspection_result = case
                -- The usual case: nothing else of the entry was captured at or after this record and its declaration
                -- is still the newest, so this new record's chain has the latest root and is the current one: its
                -- verdict, without walking the entry's whole history (the walk stays for the rest).
                when not exists (select 1 from inspections o
                                  where o.entry_id = :entryId and o.id <> :id and o.captured_at >= cast(:capturedAt as timestamptz))
                 and not exists (select 1 from boat_declaration_versions d where d.boat_id = :boatId and d.version > :shownVersion)
                then :overall
                else (select i.overall_result from inspections i where i.id = (select id from current_inspection)) end,
              updated_at = now()
        where id = :entryId and exists (select 1 from inserted)),
     settled as (${settleAskedSql} and exists (select 1 from inserted) returning r.id),
     task as (
       update reinspections set inspection_id = :id, done_at = now(), updated_at = now()
        where id = :reinspectionId and done_at is null and id not in (select id from settled)
          and ${MEASURED_AFTER_TASK} and exists (select 1 from inserted)),
     mail as (${outboxInsertSql('outboxMail')} where exists (select 1 from inserted))
     select 1`;

/**
 * A new record of the boat's latest declaration, with no seal events, as two prepared statements in one
 * transaction sent in one round trip (PostgreSQL plans each once per connection: planning the follow-up as
 * text cost more than running it). The follow-up acts only if the insert inserted (it cannot read the
 * insert's answer). Null when nothing was inserted: the caller then takes the full transaction, which tells
 * a replay from a declaration edit.
 */
async function writeInOneTrip(
  row: NewRecordRow,
  { declarationVersionId, shownVersion, mail }: { declarationVersionId: string; shownVersion: number; mail: string },
): Promise<Inserted | null> {
  const id = randomUUID();
  // No correction takes this path, so the boat was measured at the record's capture time.
  const values = { ...row, id, declarationVersionId, shownVersion, outboxMail: mail, measuredAt: row.capturedAt };
  const [insertedRows] = await preparedPipeline([
    { name: 'record-inspection:insert', sql: ONE_TRIP_INSERT, values },
    { name: 'record-inspection:follow-up', sql: ONE_TRIP_FOLLOW_UP, values },
  ]);
  return (insertedRows[0] as Inserted | undefined) ?? null;
}

/** The entrant's result mail, queued with the record (sent by the outbox worker, never on the request path). */
function entrantMail(entry: EntryRow, decision: InspectionDecision): QueuedMail {
  const { entrantEmail, boatName, raceNumber, eventName } = entry;
  const lines = decision.rules.map((r) => `- ${r.label}: ${VERDICT_WORDS[r.verdict].toLowerCase()}. ${r.explanation}`);
  return {
    kind: 'inspection_result',
    to: entrantEmail,
    subject: `${boatName} (no. ${raceNumber}): inspection result ${VERDICT_WORDS[decision.overall].toLowerCase()}`,
    text: [
      `${boatName} was inspected at ${eventName}. Overall: ${VERDICT_WORDS[decision.overall].toLowerCase()}.`,
      ...(describeScope(decision.scope) ? [describeScope(decision.scope)!] : []),
      '',
      ...lines,
      '',
      'Safety first: Boreline supports the checks; it never replaces them. The governing body’s rules, local regulations and the judgement of licensed officials decide every verdict and every safety matter. Ask the chief scrutineer about this result.',
    ].join('\n'),
  };
}

/**
 * Records one inspection of an entry at the event, decided against the class rule version in force
 * when it was captured. Idempotent by the device-made key: the same key again returns the stored
 * record (created: false). Records are append-only; a correction is a new record that supersedes.
 */
export async function recordInspection(
  actor: Actor | null,
  eventId: string,
  raw: unknown,
): Promise<{ inspection: InspectionView; created: boolean }> {
  assertCan(actor, 'inspection.record', { eventId });
  const { models, sequelize } = getDb();
  // A retry (the answer was lost, or the phone sent twice) gets the stored record back at once,
  // before the input is checked again (an offline record may be older than a new one may be).
  const key = UUID.safeParse((raw as { idempotencyKey?: unknown } | null)?.idempotencyKey);
  const entryGuess = UUID.safeParse((raw as { entryId?: unknown } | null)?.entryId);
  let entry = entryGuess.success
    ? await loadEntry(eventId, entryGuess.data.toLowerCase(), key.success ? key.data.toLowerCase() : null)
    : undefined;
  if (key.success && (!entry || entry.keyEventId)) {
    const existing = await findByKey(eventId, key.data.toLowerCase());
    // The same key for another boat is not a resend: answering with the first boat's record would drop this one.
    if (existing && entryGuess.success && existing.entryId !== entryGuess.data.toLowerCase())
      throw new AppError(
        'key_in_use',
        409,
        'This record key was already used for another boat’s record: nothing was recorded. Make a new record.',
      );
    if (existing) return { inspection: existing, created: false };
  }
  const input = RecordInspectionInput.parse(raw);
  const idempotencyKey = input.idempotencyKey.toLowerCase();
  if (entry && entry.id !== input.entryId.toLowerCase())
    entry = await loadEntry(eventId, input.entryId.toLowerCase(), null);
  if (!entry) throw fieldError('entryId', 'No such entry at this meeting.');
  // Separation of duties: nobody inspects a boat they entered or own, whatever their staff roles.
  if (entry.entrantId === actor.id || entry.ownerId === actor.id) {
    throw new AppError('own_boat', 403, 'You cannot inspect a boat you entered or own: ask another scrutineer.');
  }
  if (entry.status === 'withdrawn' || entry.status === 'cancelled') {
    throw new AppError(
      'entry_not_live',
      409,
      `Race number ${entry.raceNumber} is ${entry.status}: it is not inspected.`,
    );
  }

  // The declaration the scrutineer saw must still be the boat's: a record of a version edited away since the
  // card was opened would otherwise be filed as an inspection of the new one (attack finding F7). Nothing is stored.
  const shownVersion = input.declarationVersion;
  if (shownVersion != null && shownVersion !== entry.latestDeclarationVersion) {
    throw new AppError(
      'declaration_changed',
      409,
      `The boat’s declaration changed after its card was opened: the card showed version ${shownVersion}, the boat is now at version ${entry.latestDeclarationVersion}. Nothing was recorded: reload the boat card, check the new declaration and record again.`,
    );
  }

  let measuredAt = new Date(input.capturedAt);
  let isProtestCorrection = false;
  if (input.supersedesId) {
    const original = await models.Inspection.findOne({ where: { id: input.supersedesId, entryId: entry.id } });
    if (!original) throw fieldError('supersedesId', 'Only an earlier record of the same entry can be corrected.');
    // One correction per record: a second would fork the history (correct the correction instead).
    const correction = await models.Inspection.findOne({ where: { supersedesId: original.id }, attributes: ['id'] });
    if (correction) throw alreadyCorrected();
    // A correction restates that inspection, so it is decided under the rules in force then.
    measuredAt = original.capturedAt;
    isProtestCorrection = original.kind === 'protest';
  }
  let scope: CheckArea[] | null = null;
  let isProtestTask = false;
  if (input.reinspectionId) {
    const task = await models.Reinspection.findOne({ where: { id: input.reinspectionId, eventId, entryId: entry.id } });
    if (!task) throw fieldError('reinspectionId', 'This re-inspection task is not for this entry.');
    // A protest's re-inspection decides only the checks the protest asked for.
    if (task.protestId) {
      isProtestTask = true;
      const protest = await models.Protest.findByPk(task.protestId, { attributes: ['id', 'requestedChecks'] });
      scope = scopeFromRequestedChecks(protest?.requestedChecks);
    }
  }
  // The kind sets the burden of proof (a protest puts it on the protester): a "protest" inspection is
  // the re-inspection a steward ordered for a protest against this entry, or a correction of one.
  if (input.kind === 'protest' && !isProtestTask && !isProtestCorrection)
    throw fieldError(
      'kind',
      'A protest inspection is the re-inspection a steward ordered for a protest against this boat: record it from that task, or choose another kind.',
    );
  // The version in force when the boat was measured (as findRulesInForce picks it), from the versions
  // that came with the entry (one query fewer per record); its rules from this process's copy of the frozen version.
  const versionInForce = (entry.publishedVersions ?? []).find((v) => v.effectiveFromMs <= measuredAt.getTime());
  const inForceRules = versionInForce ? await publishedRules(versionInForce.id) : null;
  const ruleVersion = versionInForce && inForceRules ? { ...versionInForce, rules: inForceRules } : null;
  if (!ruleVersion) {
    throw new AppError(
      'no_rules_in_force',
      409,
      `No published rules of ${entry.className} were in force at ${measuredAt.toISOString()}: the organiser must publish the class rules before boats are inspected.`,
    );
  }
  const [nozzleInstrument, weightInstrument, { itemInstruments, gaugeInstrument }] = await Promise.all([
    findInstrument(eventId, input.nozzle.instrumentId, 'length', 'nozzle.instrumentId', measuredAt),
    findInstrument(eventId, input.weight?.instrumentId ?? null, 'mass', 'weight.instrumentId', measuredAt),
    // The class's measured items and the gauge check: items the rules lack, instrument types they do not allow, calibration.
    resolveItemInstruments(eventId, input, ruleVersion.rules, measuredAt),
  ]);
  // The dyno sheet must be one of this boat's own uploaded documents.
  let dynoDocument: { id: string; fileName: string } | null = null;
  if (input.power.dynoDocumentId) {
    const doc = await models.BoatDocument.findOne({
      where: { id: input.power.dynoDocumentId, boatId: entry.boatId },
      attributes: ['id', 'fileName'],
    });
    if (!doc) throw fieldError('power.dynoDocumentId', 'This document is not one of this boat’s uploaded documents.');
    dynoDocument = { id: doc.id, fileName: doc.fileName };
  }
  // Seals checked, applied and removed, against the register and the boat's components now (400 naming the field).
  const sealPlan = await planInspectionSeals(eventId, entry.boatId, input.seals);
  // Declared dated gear judged on the record's meeting day: an expired item, or one not presented or not as
  // declared at the dock that day, is a finding in the verdict (read only when the entry declares gear).
  const gear = entry.gearItems > 0 ? await gearOnDay(entry.id, measuredAt) : null;
  // Throws EngineInputError naming the field (too few readings for this class): 400.
  const decision = decideInspection({
    gear,
    input,
    rules: ruleVersion.rules,
    nozzleInstrument,
    weightInstrument,
    itemInstruments,
    gaugeInstrument,
    scope,
    sealFindings: sealPlan.findings,
  });

  const { measurements, results } = buildInspectionRecord({
    input,
    decision,
    rules: ruleVersion.rules,
    ruleVersion: ruleVersion.version,
    nozzleInstrument,
    weightInstrument,
    itemInstruments,
    gaugeInstrument,
    boat: { declaredKw: entry.boatDeclaredKw, powerEvidence: entry.boatPowerEvidence },
    sealActions: sealPlan.actions,
    dynoDocument,
  });

  const row = {
    eventId,
    entryId: entry.id,
    boatId: entry.boatId,
    classId: entry.classId,
    ruleVersionId: ruleVersion.id,
    kind: input.kind,
    recordedById: actor.id,
    device: input.device,
    idempotencyKey,
    capturedAt: new Date(input.capturedAt),
    supersedesId: input.supersedesId,
    correctionReason: input.correctionReason,
    reinspectionId: input.reinspectionId,
    measurements: JSON.stringify(measurements),
    results: JSON.stringify(results),
    overall: decision.overall,
    notes: input.notes,
  };
  const mail = outboxRows([entrantMail(entry, decision)]);
  // Nearly every record is new, checks the boat's latest declaration (the dock sends the version it showed)
  // and touches no seal: such a record is written in one round trip. Anything else, or a record that lost
  // a race with a declaration edit or a parallel copy of itself, takes the full transaction below.
  const oneTrip =
    !input.supersedesId &&
    shownVersion != null &&
    entry.latestDeclarationVersionId != null &&
    sealPlan.events.length === 0 &&
    (await writeInOneTrip(row, { declarationVersionId: entry.latestDeclarationVersionId, shownVersion, mail }));
  const inserted =
    oneTrip ||
    (await sequelize
      .transaction(async (transaction) => {
        // One writer per entry at a time, so the entry's result always reflects every committed record:
        // the insert first takes the entry's row lock (in the same statement, one round trip fewer), and
        // the update below starts after it, so it sees every record committed before the lock was granted.
        const rows = await sequelize.query<Inserted>(
          `with locked as (select id from entries where id = :entryId for update)
       insert into inspections (${INSERT_COLUMNS}, declaration_version_id)
       select ${INSERT_VALUES},
              -- The version the dock showed (checked above to be the latest), else (an older client) the version in
              -- force when the boat was measured, else the first: a record never pins a version made after its capture.
              (select d.id from boat_declaration_versions d where d.boat_id = :boatId
                order by d.version = :shownVersion desc nulls last,
                         d.created_at <= :measuredAt desc, case when d.created_at <= :measuredAt then d.version end desc nulls last, d.version
                limit 1)
         from locked
       on conflict (idempotency_key) do nothing
       returning id, received_at as "receivedAt", declaration_version_id as "declarationVersionId"`,
          {
            replacements: {
              ...row,
              measuredAt,
              // A correction restates an earlier inspection: it pins the version in force then, as before.
              shownVersion: input.supersedesId ? null : shownVersion,
            },
            type: QueryTypes.SELECT,
            transaction,
          },
        );
        if (rows.length === 0) return null; // the same key committed a moment ago by a parallel request
        const { id } = rows[0];
        // The seal events belong to this record: written here, so a replay (no row inserted above) writes none.
        await writeInspectionSealEvents(
          sealPlan,
          { inspectionId: id, eventId, boatId: entry.boatId, recordedById: actor.id },
          transaction,
        );
        const replacements = { id, entryId: entry.id, declarationVersionId: rows[0].declarationVersionId, measuredAt };
        // What follows the insert, in one statement (one round trip per record, not four), on one snapshot
        // that includes the insert above: inspections are never updated, so the entry carries the current
        // record's result for quick reading; the entrant's result mail is queued (sent by the outbox worker,
        // so a rolled-back record sends nothing); and when the record checked the boat's latest declaration
        // (nearly always), the tasks it answers are settled here too.
        const [latestVersion] = await sequelize.query<{ id: string }>(
          `with ${currentInspectionCte('entry')},
       latest as (select d.id from boat_declaration_versions d where d.boat_id = :boatId order by d.version desc limit 1),
       entry_result as (
         -- By primary key: a join let the planner scan every meeting's inspections for this one row.
         update entries set inspection_result = (select i.overall_result from inspections i where i.id = (select id from current_inspection)),
                updated_at = now()
          where id = :entryId),
       settled as (${settleAskedSql} and exists (select 1 from latest where latest.id = :declarationVersionId) returning r.id),
       task as (
         update reinspections set inspection_id = :id, done_at = now(), updated_at = now()
          where id = :reinspectionId and done_at is null and exists (select 1 from latest where latest.id = :declarationVersionId)
            and ${MEASURED_AFTER_TASK}
            and id not in (select id from settled)),
       mail as (${outboxInsertSql('outboxMail')})
       select id from latest`,
          {
            replacements: {
              ...replacements,
              boatId: entry.boatId,
              reinspectionId: input.reinspectionId,
              outboxMail: mail,
            },
            type: QueryTypes.SELECT,
            transaction,
          },
        );
        // A record of a version already replaced (it waited offline, or crossed an edit) does not count:
        // the entry is marked for re-inspection with what changed since, as the owner's edit would have
        // (the chief scrutineers' mail queued with it), and only then are tasks settled, in that order.
        if (latestVersion && latestVersion.id !== rows[0].declarationVersionId) {
          const newer = await models.BoatDeclarationVersion.findByPk(latestVersion.id, { transaction });
          const latest = {
            ...pickDeclaration(newer as unknown as DeclarationFields),
            id: newer!.id,
            version: newer!.version,
          };
          const flagged = await flagInspectedEntries(actor.id, latest, transaction);
          await mailChiefScrutineers(entry.boatName, flagged, transaction);
          await sequelize.query(settleAskedSql, { replacements, transaction });
          if (input.reinspectionId) {
            await sequelize.query(
              `update reinspections set inspection_id = :id, done_at = now(), updated_at = now()
              where id = :reinspectionId and done_at is null and ${MEASURED_AFTER_TASK}`,
              { replacements: { ...replacements, reinspectionId: input.reinspectionId }, transaction },
            );
          }
        }
        return rows[0];
      })
      .catch((err: unknown) => {
        // Two corrections of one record at the same moment: the unique index keeps the first.
        const pg = (err as { parent?: { code?: string; constraint?: string } }).parent;
        if (pg?.code === '23505' && pg.constraint === 'inspections_supersedes_id') throw alreadyCorrected();
        throw err;
      }));

  if (!inserted) {
    const existing = await findByKey(eventId, idempotencyKey);
    if (!existing) throw new AppError('conflict', 409, 'The record could not be stored; send it again.');
    return { inspection: existing, created: false };
  }
  // The mails were queued with the record: the scrutineer at the dock never waits for SMTP.
  // The new record as loadInspectionViews would read it, from what was just written (one query fewer per record).
  const view: InspectionView = {
    id: inserted.id,
    eventId,
    entryId: entry.id,
    boatId: entry.boatId,
    classId: entry.classId,
    ruleVersionId: ruleVersion.id,
    ruleVersion: ruleVersion.version,
    kind: input.kind,
    recordedBy: { id: actor.id, name: actor.name ?? actor.email },
    device: input.device,
    idempotencyKey,
    capturedAt: new Date(input.capturedAt).toISOString(),
    receivedAt: new Date(inserted.receivedAt).toISOString(),
    supersedesId: input.supersedesId,
    supersededById: null,
    correctionReason: input.correctionReason,
    reinspectionId: input.reinspectionId,
    measurements,
    rules: decision.rules,
    overallResult: decision.overall,
    notes: input.notes,
    photoCount: 0,
  };
  return { inspection: view, created: true };
}

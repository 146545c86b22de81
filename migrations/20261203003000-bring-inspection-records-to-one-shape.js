'use strict';
// Brings every stored inspection record (the measurements and results JSONB) to the one shape of
// models/shapes/inspection-record.ts. Older rows came in two shapes: recording's (weight without
// its mean when the class had no minimum) and the demo seed's (no ruleVersion or scope in the
// results, the typed U under `expandedUncertaintyMm`, no temperatureCorrected flag, no instrument
// name for the scale, no boat power figures). Nothing is recomputed: a field is filled only from
// the row itself or from the rows it names (its rule version, its boat, its instruments); a row
// that would need a figure invented stops the migration with its id.
//
// Inspections are append-only: the inspections_append_only trigger refuses every update. This
// migration disables that trigger inside its own transaction, updates the rows it must, and
// enables it again before committing. ALTER TABLE holds an ACCESS EXCLUSIVE lock on inspections
// until the transaction ends, so no other session can write (or read) while the trigger is off,
// and a failure rolls the whole step back, trigger included (DDL is transactional in PostgreSQL).
// This is the one sanctioned rewrite of stored records: the shape changes, no verdict does.
const { isDeepStrictEqual } = require('node:util');

const num = (x) => (x == null ? null : Number(x));

/** The row in the one shape, from what it stores and the rows it names. Throws naming the row when it cannot. */
function bringRecordToOneShape(row) {
  const fail = (why) => { throw new Error(`inspection ${row.id}: ${why}; bring it to the stored shape by hand`); };
  const m = row.measurements && typeof row.measurements === 'object' ? row.measurements : {};
  const res = Array.isArray(row.results) ? { rules: row.results } : row.results && typeof row.results === 'object' ? row.results : {};
  const rules = Array.isArray(res.rules) ? res.rules : [];
  for (const r of rules) {
    if (typeof r?.rule !== 'string' || typeof r.label !== 'string' || typeof r.explanation !== 'string' || typeof r.measured !== 'boolean' || typeof r.verdict !== 'string') {
      fail('a rule verdict lacks its rule, label, verdict, explanation or measured flag');
    }
  }
  const n = m.nozzle && typeof m.nozzle === 'object' ? m.nozzle : {};
  const readings = Array.isArray(n.readings) ? n.readings : [];
  if (readings.some((r) => typeof r?.diameterMm !== 'number' || typeof r.angleDeg !== 'number')) fail('a nozzle reading lacks its diameter or angle');
  const temperatureC = num(n.temperatureC);
  const material = n.material ?? null;
  const temperatureCorrected = typeof n.temperatureCorrected === 'boolean' ? n.temperatureCorrected : temperatureC != null && material != null;
  let correctedReadingsMm = n.correctedReadingsMm;
  if (!Array.isArray(correctedReadingsMm)) {
    // Without a temperature and material no correction applied: the readings are what the verdict used.
    if (temperatureCorrected) fail('the readings were corrected for temperature but the corrected readings are not stored');
    correctedReadingsMm = readings.map((r) => r.diameterMm);
  }
  const typedExpandedUncertaintyMm = 'typedExpandedUncertaintyMm' in n ? num(n.typedExpandedUncertaintyMm) : num(n.expandedUncertaintyMm);
  const instrumentId = n.instrumentId ?? null;
  let appliedExpandedUncertaintyMm = num(n.appliedExpandedUncertaintyMm);
  let uncertaintyBasis = typeof n.uncertaintyBasis === 'string' ? n.uncertaintyBasis : null;
  if (appliedExpandedUncertaintyMm == null) {
    const nozzleRule = rules.find((r) => r.rule.startsWith('nozzle') && typeof r.expandedUncertainty === 'number');
    if (nozzleRule) appliedExpandedUncertaintyMm = nozzleRule.expandedUncertainty;
    else if (!instrumentId && typedExpandedUncertaintyMm != null) appliedExpandedUncertaintyMm = typedExpandedUncertaintyMm;
    else if (!instrumentId) appliedExpandedUncertaintyMm = num(row.class_rules?.nozzle?.defaultUncertaintyMm);
    if (appliedExpandedUncertaintyMm == null) fail('the nozzle uncertainty the verdict applied is not stored');
    uncertaintyBasis ??= nozzleRule ? 'as the verdict applied it (basis not stored with this record)' : !instrumentId && typedExpandedUncertaintyMm != null ? 'as entered' : 'the class default (no instrument recorded)';
  }
  uncertaintyBasis ??= 'not stored with this record';

  const w = m.weight && typeof m.weight === 'object' ? m.weight : null;
  const p = m.power && typeof m.power === 'object' ? m.power : {};
  // The boat's figures as they stand now: the nearest record of what the entrant declared when it was inspected.
  const boatDeclaredKw = num(p.boatDeclaredKw) ?? num(row.boat_declared_kw);
  const declaredKw = num(p.declaredKw) ?? boatDeclaredKw;
  if (declaredKw == null || boatDeclaredKw == null) fail('no power figure');
  const decisionRule = res.decisionRule ?? row.class_rules?.decisionRule;
  if (!decisionRule) fail('no decision rule');

  return {
    measurements: {
      nozzle: {
        readings: readings.map((r) => ({ diameterMm: r.diameterMm, angleDeg: r.angleDeg })),
        instrumentId,
        instrumentName: n.instrumentName ?? row.nozzle_instrument_name ?? null,
        typedExpandedUncertaintyMm,
        temperatureC,
        material,
        correctedReadingsMm,
        temperatureCorrected,
        appliedExpandedUncertaintyMm,
        uncertaintyBasis,
      },
      weight: w
        ? {
            readingsKg: Array.isArray(w.readingsKg) ? w.readingsKg : [],
            instrumentId: w.instrumentId ?? null,
            instrumentName: w.instrumentName ?? row.weight_instrument_name ?? null,
            meanKg: num(w.meanKg),
            expandedUncertaintyKg: num(w.expandedUncertaintyKg),
            uncertaintyBasis: typeof w.uncertaintyBasis === 'string' ? w.uncertaintyBasis : null,
          }
        : null,
      power: {
        declaredKw,
        evidenceSeen: p.evidenceSeen === true,
        note: typeof p.note === 'string' ? p.note : '',
        boatDeclaredKw,
        boatPowerEvidence: typeof p.boatPowerEvidence === 'string' ? p.boatPowerEvidence : row.boat_power_evidence,
      },
      seals: Array.isArray(m.seals) ? m.seals : [],
      safety: m.safety && typeof m.safety === 'object' ? m.safety : {},
    },
    results: {
      rules,
      decisionRule,
      ruleVersion: res.ruleVersion ?? row.rule_version,
      scope: Array.isArray(res.scope) && res.scope.length ? res.scope : null,
    },
  };
}

/**
 * Brings the records to the one shape (all of them, or only `ids`), in one transaction with the
 * append-only trigger off for its duration. Returns how many rows changed. Safe to run again.
 */
async function bringInspectionsToOneShape(sequelize, { ids } = {}) {
  return sequelize.transaction(async (transaction) => {
    // Taken first, so the rows read below cannot change before they are written back.
    await sequelize.query('lock table inspections in access exclusive mode', { transaction });
    const [rows] = await sequelize.query(
      `select i.id, i.measurements, i.results, v.version as rule_version, v.rules as class_rules,
              b.declared_power_kw as boat_declared_kw, b.power_evidence as boat_power_evidence,
              (select x.name from instruments x where x.id::text = i.measurements #>> '{nozzle,instrumentId}') as nozzle_instrument_name,
              (select x.name from instruments x where x.id::text = i.measurements #>> '{weight,instrumentId}') as weight_instrument_name
         from inspections i
         join class_rule_versions v on v.id = i.rule_version_id
         join boats b on b.id = i.boat_id
        ${ids ? 'where i.id in (:ids)' : ''}`,
      { replacements: ids ? { ids } : {}, transaction },
    );
    const changed = [];
    for (const row of rows) {
      const next = bringRecordToOneShape(row);
      if (!isDeepStrictEqual(next, { measurements: row.measurements, results: row.results })) changed.push({ id: row.id, ...next });
    }
    if (changed.length === 0) return 0;
    await sequelize.query('alter table inspections disable trigger inspections_append_only', { transaction });
    for (const c of changed) {
      await sequelize.query('update inspections set measurements = :m::jsonb, results = :r::jsonb where id = :id', {
        replacements: { id: c.id, m: JSON.stringify(c.measurements), r: JSON.stringify(c.results) },
        transaction,
      });
    }
    await sequelize.query('alter table inspections enable trigger inspections_append_only', { transaction });
    return changed.length;
  });
}

/** @type {import('sequelize-cli').Migration} */
const migration = {
  async up(queryInterface) {
    await bringInspectionsToOneShape(queryInterface.sequelize);
  },
  // The one shape holds everything the older shapes held (the typed U under its new name), so
  // there is nothing to undo: older code reads what it needs from it.
  async down() {},
};

// The backfill is exported as well, so a test can run it on rows of its own through the real database.
module.exports = { ...migration, bringInspectionsToOneShape, bringRecordToOneShape };

// Demo scenario (invented), part three: dock inspections of the paid entries in the Kelda Reach
// SS and GP classes, decided by the product's own decision code against the rules in force, so the
// inspection board and the parity report have something to show; and one part in custody. Run by the start command after the
// sequelize seeders; fixed idempotency keys make running it twice harmless.
import { createHash } from 'node:crypto';
import pg from 'pg';
import { decideInspection } from '../lib/core/inspections/decide-inspection';
import { buildInspectionRecord } from '../lib/core/inspections/inspection-record';
import { toInstrumentFigures, withCertificateFigures } from '../lib/core/inspections/instrument-figures';
import { RecordInspectionInput } from '../lib/core/inputs/inspections';
import type { ClassRules } from '../lib/core/inputs/class-rules';

const MEETING = '0b0e0000-0000-4000-8000-000000000101';
const CALIPER = '0b0e0000-0000-4000-8501-000000000001';
const SCALE = '0b0e0000-0000-4000-8501-000000000004';

// A UUID-shaped key derived from the entry id, so re-running finds the same record.
const keyFor = (entryId: string) => {
  const h = createHash('sha256').update(`demo-inspection:${entryId}`).digest('hex');
  return `${h.slice(0, 8)}-${h.slice(8, 12)}-4${h.slice(13, 16)}-8${h.slice(17, 20)}-${h.slice(20, 32)}`;
};

async function main() {
  const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  const [scrutineer] = (await db.query(`select id from users where email = 'scrutineer@tarnwater.example'`)).rows;
  const instruments = (
    await db.query(
      `select id, name, quantity, error_limit as "errorLimit", resolution, expanded_uncertainty as "expandedUncertainty" from instruments where id = any($1)`,
      [[CALIPER, SCALE]],
    )
  ).rows;
  // The latest certificate of each (seeders/20261203006100-demo-calibration.js): its stated U is what the verdict uses.
  const certificates = (
    await db.query(
      `select distinct on (instrument_id) instrument_id as "instrumentId", number, laboratory,
              expanded_uncertainty as "expandedUncertainty", coverage_factor as "coverageFactor"
         from calibration_certificates where instrument_id = any($1) and due_on >= current_date
        order by instrument_id, calibrated_on desc`,
      [[CALIPER, SCALE]],
    )
  ).rows as {
    instrumentId: string;
    number: string;
    laboratory: string;
    expandedUncertainty: number | null;
    coverageFactor: number;
  }[];
  const figures = (id: string) =>
    withCertificateFigures(
      toInstrumentFigures(instruments.find((x) => x.id === id)!),
      certificates.find((c) => c.instrumentId === id) ?? null,
    );
  const entries = (
    await db.query(
      `select e.id, e.boat_id, e.class_id, b.declared_nozzle_mm, b.declared_power_kw, b.declared_weight_kg, b.power_evidence,
            v.id as rule_version_id, v.version as rule_version, v.rules
       from entries e join boats b on b.id = e.boat_id join race_classes c on c.id = e.class_id
       join lateral (select * from class_rule_versions v where v.class_id = c.id and v.status = 'published' and v.effective_from <= now()
                     order by v.effective_from desc limit 1) v on true
      where e.event_id = $1 and e.status = 'entered' and c.code in ('SS', 'GP') order by e.race_number`,
      [MEETING],
    )
  ).rows;
  let added = 0;
  for (const [n, e] of entries.entries()) {
    const rules = e.rules as ClassRules;
    const d = Number(e.declared_nozzle_mm);
    const offsets = [-0.03, 0.02, 0.01, -0.01].slice(0, Math.max(3, rules.nozzle.minReadings));
    // The same input the dock form sends, parsed by the same schema, so the seed records what recording would.
    const input = RecordInspectionInput.parse({
      idempotencyKey: keyFor(e.id),
      entryId: e.id,
      capturedAt: new Date().toISOString(),
      device: 'demo seed',
      nozzle: {
        readings: offsets.map((o, i) => ({ diameterMm: +(d + o).toFixed(2), angleDeg: i * 60 })),
        instrumentId: CALIPER,
        expandedUncertaintyMm: null,
        temperatureC: null,
        material: null,
      },
      weight: { readingsKg: [Number(e.declared_weight_kg), Number(e.declared_weight_kg) + 1], instrumentId: SCALE },
      power: { declaredKw: Number(e.declared_power_kw), evidenceSeen: n % 3 !== 0, note: '' },
      safety: Object.fromEntries(rules.safetyItems.map((s) => [s, true])),
    });
    const nozzleInstrument = figures(CALIPER);
    const weightInstrument = figures(SCALE);
    const decision = decideInspection({ input, rules, nozzleInstrument, weightInstrument });
    const { measurements, results } = buildInspectionRecord({
      input,
      decision,
      rules,
      ruleVersion: e.rule_version,
      nozzleInstrument,
      weightInstrument,
      boat: { declaredKw: Number(e.declared_power_kw), powerEvidence: e.power_evidence },
    });
    const res = await db.query(
      `insert into inspections (event_id, entry_id, boat_id, class_id, rule_version_id, kind, recorded_by_id, device, idempotency_key, captured_at, measurements, results, overall_result, notes)
       values ($1, $2, $3, $4, $5, 'pre_race', $6, 'demo seed', $7, now() - interval '1 hour', $8, $9, $10, 'Demo record') on conflict (idempotency_key) do nothing`,
      [
        MEETING,
        e.id,
        e.boat_id,
        e.class_id,
        e.rule_version_id,
        scrutineer.id,
        keyFor(e.id),
        JSON.stringify(measurements),
        JSON.stringify(results),
        decision.overall,
      ],
    );
    if (res.rowCount) {
      added++;
      await db.query('update entries set inspection_result = $2 where id = $1', [e.id, decision.overall]);
    }
  }
  console.log(`[seed] demo inspections: ${added} added, ${entries.length - added} already there`);
  // One part in the officials' custody, so the custody list has something to show.
  if (entries.length) {
    const held = await db.query(
      `insert into custody_items (id, event_id, entry_id, description, seal_number, taken_by_id, taken_at)
       values ('0b0e0000-0000-4000-8601-000000000001', $1, $2, 'Ride plate, cracked at the rear fixing', 'KR-BAG-01', $3, now() - interval '40 minutes')
       on conflict (id) do nothing`,
      [MEETING, entries[0].id, scrutineer.id],
    );
    console.log(`[seed] demo custody: ${held.rowCount ? 'one part taken' : 'already there'}`);
  }
  await db.end();
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});

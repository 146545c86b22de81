// Issue 15, item 6 (first half): the migration gives each boat that existed before it a version 1
// made from the boat's row as it stood, by its owner. Through the real database: a boat written with
// the first-version trigger held off (as boats were before the migration) gets exactly its row as
// version 1 from the migration's own backfill; a boat that already has versions is left alone.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { Sequelize } from 'sequelize';
import { DEMO } from '../support/env';
import { query } from '../support/db';
import backfill from '../../migrations/20261203004000-create-boat-declaration-versions.js';

let sequelize: Sequelize;
before(() => {
  sequelize = new Sequelize(process.env.DATABASE_URL!, { logging: false });
});
after(async () => {
  await sequelize?.close();
});

test('a boat from before the migration gets version 1 from its row, by its owner; nothing else changes', async () => {
  const [owner] = await query<{ id: string }>('select id from users where email = $1', [DEMO.entrant]);
  // A boat as it was stored before versions existed: the trigger is off for this one insert only
  // (inside one transaction, so no other session ever sees it off).
  const boatId = await sequelize.transaction(async (transaction) => {
    await sequelize.query('alter table boats disable trigger boats_first_declaration_version', { transaction });
    const [rows] = await sequelize.query(
      `insert into boats (owner_id, name, pump_description, engine_description, declared_nozzle_mm, declared_power_kw,
                          power_evidence, declared_weight_kg, updated_at)
       values (:owner, 'Backfill Boat', 'Axial pump', 'V8', 101.2, 231.5, 'maker_rating', 415, now() - interval '3 days')
       returning id`,
      { replacements: { owner: owner.id }, transaction },
    );
    await sequelize.query('alter table boats enable trigger boats_first_declaration_version', { transaction });
    return (rows as { id: string }[])[0].id;
  });
  assert.equal(
    (await query('select 1 from boat_declaration_versions where boat_id = $1', [boatId])).length,
    0,
    'written as before the migration',
  );
  const added = await backfill.addFirstVersions(sequelize, { boatIds: [boatId] });
  assert.equal(added, 1);
  const [v] = await query<Record<string, unknown>>(
    `select d.version, d.pump_description, d.engine_description, d.declared_nozzle_mm, d.declared_power_kw, d.power_evidence,
            d.declared_weight_kg, d.created_by_id, d.created_at = b.updated_at as "atLastChange"
       from boat_declaration_versions d join boats b on b.id = d.boat_id where d.boat_id = $1`,
    [boatId],
  );
  assert.deepEqual(v, {
    version: 1,
    pump_description: 'Axial pump',
    engine_description: 'V8',
    declared_nozzle_mm: 101.2,
    declared_power_kw: 231.5,
    power_evidence: 'maker_rating',
    declared_weight_kg: 415,
    created_by_id: owner.id,
    atLastChange: true,
  });
  // Run again: a boat with a version gets no second version 1.
  assert.equal(await backfill.addFirstVersions(sequelize, { boatIds: [boatId] }), 0);
  // The trigger is back on: a new boat gets its version 1 at once.
  const [fresh] = await query<{ id: string }>(
    `insert into boats (owner_id, name, declared_nozzle_mm, declared_power_kw) values ($1, 'After Boat', 101, 200) returning id`,
    [owner.id],
  );
  const versions = await query<{ version: number }>(
    'select version from boat_declaration_versions where boat_id = $1',
    [fresh.id],
  );
  assert.deepEqual(versions, [{ version: 1 }]);
});

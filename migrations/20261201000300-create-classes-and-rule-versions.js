'use strict';
// Event details for inspection and fees; classes; versioned class rules (published versions frozen).
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface, Sequelize) {
    const { UUID, STRING, DATE, INTEGER, DOUBLE, TEXT, JSONB } = Sequelize;
    const id = { type: UUID, primaryKey: true, defaultValue: Sequelize.literal('gen_random_uuid()') };
    const stamps = {
      created_at: { type: DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
      updated_at: { type: DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
    };
    const ref = (table, allowNull = false) => ({ type: UUID, allowNull, references: { model: table, key: 'id' }, onDelete: allowNull ? 'SET NULL' : 'CASCADE' });

    await queryInterface.addColumn('events', 'water_kind', { type: STRING, allowNull: false, defaultValue: 'fresh' });
    await queryInterface.addColumn('events', 'water_temperature_c', { type: DOUBLE, allowNull: false, defaultValue: 15 });
    await queryInterface.addColumn('events', 'water_density_kg_m3', { type: DOUBLE });
    await queryInterface.addColumn('events', 'protest_window_minutes', { type: INTEGER, allowNull: false, defaultValue: 30 });
    await queryInterface.addColumn('events', 'currency', { type: STRING(3), allowNull: false, defaultValue: 'NZD' });
    await queryInterface.addColumn('events', 'entry_fee_minor', { type: INTEGER, allowNull: false, defaultValue: 0 });
    await queryInterface.addColumn('events', 'protest_fee_minor', { type: INTEGER, allowNull: false, defaultValue: 0 });
    await queryInterface.sequelize.query(`
      alter table events
        add constraint events_water_kind_check check (water_kind in ('fresh', 'sea')),
        add constraint events_fees_check check (entry_fee_minor >= 0 and protest_fee_minor >= 0),
        add constraint events_window_check check (protest_window_minutes between 0 and 1440),
        add constraint events_dates_check check (ends_on >= starts_on)`);

    await queryInterface.createTable('race_classes', {
      id, event_id: ref('events'),
      name: { type: STRING, allowNull: false },
      code: { type: STRING(12), allowNull: false },
      description: { type: TEXT, allowNull: false, defaultValue: '' },
      copied_from_id: ref('race_classes', true),
      ...stamps,
    });
    await queryInterface.addIndex('race_classes', ['event_id', 'code'], { unique: true });

    await queryInterface.createTable('class_rule_versions', {
      id, class_id: ref('race_classes'),
      version: { type: INTEGER, allowNull: false },
      status: { type: STRING, allowNull: false, defaultValue: 'draft' },
      rules: { type: JSONB, allowNull: false },
      change_note: { type: TEXT, allowNull: false, defaultValue: '' },
      effective_from: { type: DATE },
      published_at: { type: DATE },
      published_by_id: ref('users', true),
      ...stamps,
    });
    await queryInterface.addIndex('class_rule_versions', ['class_id', 'version'], { unique: true });
    await queryInterface.addIndex('class_rule_versions', ['class_id'], { unique: true, where: { status: 'draft' }, name: 'class_rule_versions_one_draft' });
    await queryInterface.sequelize.query(`
      alter table class_rule_versions
        add constraint class_rule_versions_status_check check (status in ('draft', 'published')),
        add constraint class_rule_versions_published_check check (status = 'draft' or (effective_from is not null and published_at is not null));
      -- A published version is frozen: nothing may change or delete it.
      create function boreline_freeze_published_rules() returns trigger language plpgsql as $$
      begin
        if old.status = 'published' then
          raise exception 'published class rules (version %) are frozen', old.version using errcode = 'P0001';
        end if;
        if tg_op = 'DELETE' then return old; end if;
        return new;
      end $$;
      create trigger class_rule_versions_frozen before update or delete on class_rule_versions
        for each row execute function boreline_freeze_published_rules();`);
  },
  async down(queryInterface) {
    await queryInterface.dropTable('class_rule_versions');
    await queryInterface.sequelize.query('drop function if exists boreline_freeze_published_rules()');
    await queryInterface.dropTable('race_classes');
    await queryInterface.sequelize.query(`alter table events drop constraint events_water_kind_check, drop constraint events_fees_check,
      drop constraint events_window_check, drop constraint events_dates_check`);
    for (const c of ['water_kind', 'water_temperature_c', 'water_density_kg_m3', 'protest_window_minutes', 'currency', 'entry_fee_minor', 'protest_fee_minor']) {
      await queryInterface.removeColumn('events', c);
    }
  },
};

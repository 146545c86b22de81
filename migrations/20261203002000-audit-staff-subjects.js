'use strict';
// Staff changes join the audit trail: a staff role row is deleted when the role is removed, so the
// trail must record the change when it happens (subject = the person). Inspections, rule versions
// and custody are read into the trail from their own append-only tables instead.
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface) {
    await queryInterface.sequelize.query(`alter table audit_events drop constraint audit_events_subject_check,
      add constraint audit_events_subject_check check (subject_type in ('protest', 'inspection', 'rules', 'results', 'entry', 'staff'))`);
  },
  async down(queryInterface) {
    await queryInterface.sequelize.query(`alter table audit_events drop constraint audit_events_subject_check,
      add constraint audit_events_subject_check check (subject_type in ('protest', 'inspection', 'rules', 'results', 'entry'))`);
  },
};

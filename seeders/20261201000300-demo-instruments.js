'use strict';
// Demo scenario (invented): the measuring instruments on the Kelda Reach meeting's list.
// Error limits and resolutions are typical catalogue figures for such instruments [memory].
const { ids, insertIgnore } = require('./20261201000100-demo-people-and-meeting.js');

module.exports = {
  async up(queryInterface) {
    await insertIgnore(queryInterface, 'instruments', [
      {
        id: '0b0e0000-0000-4000-8501-000000000001',
        event_id: ids.meeting,
        name: 'Digital caliper 0–150 mm (dock kit A)',
        quantity: 'length',
        error_limit: 0.03,
        resolution: 0.01,
        expanded_uncertainty: null,
      },
      {
        id: '0b0e0000-0000-4000-8501-000000000002',
        event_id: ids.meeting,
        name: 'Digital caliper 0–200 mm (dock kit B)',
        quantity: 'length',
        error_limit: 0.02,
        resolution: 0.01,
        expanded_uncertainty: null,
      },
      {
        id: '0b0e0000-0000-4000-8501-000000000003',
        event_id: ids.meeting,
        name: 'Bore gauge 50–160 mm (chief scrutineer)',
        quantity: 'length',
        error_limit: 0.004,
        resolution: 0.001,
        expanded_uncertainty: null,
      },
      {
        id: '0b0e0000-0000-4000-8501-000000000004',
        event_id: ids.meeting,
        name: 'Calibrated platform scale (certificate U = 1 kg)',
        quantity: 'mass',
        error_limit: null,
        resolution: null,
        expanded_uncertainty: 1,
      },
    ]);
  },
  async down(queryInterface) {
    await queryInterface.bulkDelete('instruments', { event_id: ids.meeting });
  },
};

import type { Sequelize } from 'sequelize';
import { User } from './user';
import { Account, Session, VerificationToken, initAuthRecords } from './auth-records';
import { Organisation, OrganisationMember, initOrganisations } from './organisation';
import { Event, EventStaff, StaffInvitation, initEvents } from './event';

// Defines every model and association on one Sequelize instance. Tables come from migrations/.
export function initModels(sequelize: Sequelize) {
  User.initModel(sequelize);
  initAuthRecords(sequelize);
  initOrganisations(sequelize);
  initEvents(sequelize);

  Account.belongsTo(User, { foreignKey: 'userId' });
  Session.belongsTo(User, { foreignKey: 'userId' });
  OrganisationMember.belongsTo(Organisation, { foreignKey: 'organisationId' });
  OrganisationMember.belongsTo(User, { foreignKey: 'userId' });
  Event.belongsTo(Organisation, { foreignKey: 'organisationId' });
  Organisation.hasMany(Event, { foreignKey: 'organisationId' });
  Event.hasMany(EventStaff, { foreignKey: 'eventId', as: 'staff' });
  EventStaff.belongsTo(Event, { foreignKey: 'eventId' });
  EventStaff.belongsTo(User, { foreignKey: 'userId' });
  StaffInvitation.belongsTo(Event, { foreignKey: 'eventId' });

  return { User, Account, Session, VerificationToken, Organisation, OrganisationMember, Event, EventStaff, StaffInvitation };
}

export type Models = ReturnType<typeof initModels>;
export { User, Account, Session, VerificationToken, Organisation, OrganisationMember, Event, EventStaff, StaffInvitation };

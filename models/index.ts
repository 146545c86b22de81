import type { Sequelize } from 'sequelize';
import { User } from './user';
import { Account, Session, VerificationToken, initAuthRecords } from './auth-records';
import { Organisation, OrganisationMember, initOrganisations } from './organisation';
import { Event, EventStaff, StaffInvitation, initEvents } from './event';
import { RaceClass, ClassRuleVersion, initRaceClasses } from './race-class';
import { Boat, BoatDeclarationVersion, BoatDocument, BoatTag, initBoats } from './boat';
import { Entry, PaymentEvent, initEntries } from './entry';
import { Instrument, Inspection, InspectionPhoto, Reinspection, initInspections } from './inspection';
import { CalibrationCertificate, InstrumentCheck, initInstrumentCalibration } from './instrument-calibration';
import { ParityReport, initParityReports } from './parity-report';
import { ProvisionalResults, initProvisionalResults } from './provisional-results';
import { RunTime, initRunTimes } from './run-time';
import { Protest, ProtestEvidence, initProtests } from './protest';
import { AuditEvent, initAuditEvents } from './audit-event';
import { MailOutbox, initMailOutbox } from './mail-outbox';
import { PumpCatalogueEntry, initPumpCatalogue } from './pump-catalogue';
import { InspectionSlot, SlotArrival, SlotBooking, initSlots } from './slot';
import { Incident, IncidentPhoto, initIncidents } from './incident';
import { CrewRequirement, CrewSignOn, EntryCrewMember, EntryGearItem, GearCheck, initCrew } from './crew';
import { CustodyItem, CustodyRelease, initCustody } from './custody';
import { OfficialInterest, OfficialInterestWithdrawal, initOfficialInterests } from './official-interest';
import {
  BoatComponent,
  BoatLogNote,
  ComponentEvent,
  DeclarationVersionComponent,
  Seal,
  SealBatch,
  SealEvent,
  initBoatRecord,
} from './boat-record';

// Defines every model and association on one Sequelize instance. Tables come from migrations/.
export function initModels(sequelize: Sequelize) {
  User.initModel(sequelize);
  initAuthRecords(sequelize);
  initOrganisations(sequelize);
  initEvents(sequelize);
  initRaceClasses(sequelize);
  initBoats(sequelize);
  initEntries(sequelize);
  initInspections(sequelize);
  initInstrumentCalibration(sequelize);
  initParityReports(sequelize);
  initProvisionalResults(sequelize);
  initRunTimes(sequelize);
  initProtests(sequelize);
  initAuditEvents(sequelize);
  initCustody(sequelize);
  initOfficialInterests(sequelize);
  initBoatRecord(sequelize);
  initMailOutbox(sequelize);
  initPumpCatalogue(sequelize);
  initSlots(sequelize);
  initIncidents(sequelize);
  initCrew(sequelize);

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
  Event.hasMany(RaceClass, { foreignKey: 'eventId', as: 'classes' });
  RaceClass.belongsTo(Event, { foreignKey: 'eventId' });
  RaceClass.hasMany(ClassRuleVersion, { foreignKey: 'classId', as: 'versions' });
  ClassRuleVersion.belongsTo(RaceClass, { foreignKey: 'classId' });
  Boat.belongsTo(User, { foreignKey: 'ownerId', as: 'owner' });
  Boat.hasMany(BoatDocument, { foreignKey: 'boatId', as: 'documents' });
  Boat.hasMany(BoatTag, { foreignKey: 'boatId', as: 'tags' });
  BoatTag.belongsTo(Boat, { foreignKey: 'boatId' });
  Boat.hasMany(BoatDeclarationVersion, { foreignKey: 'boatId', as: 'declarationVersions' });
  Entry.belongsTo(Event, { foreignKey: 'eventId' });
  Entry.belongsTo(RaceClass, { foreignKey: 'classId' });
  Entry.belongsTo(Boat, { foreignKey: 'boatId' });
  Entry.belongsTo(User, { foreignKey: 'entrantId', as: 'entrant' });
  Instrument.belongsTo(Event, { foreignKey: 'eventId' });
  Inspection.belongsTo(Entry, { foreignKey: 'entryId' });
  Inspection.belongsTo(User, { foreignKey: 'recordedById', as: 'recordedBy' });
  Inspection.belongsTo(ClassRuleVersion, { foreignKey: 'ruleVersionId', as: 'ruleVersion' });
  Inspection.hasMany(InspectionPhoto, { foreignKey: 'inspectionId', as: 'photos' });
  Entry.hasMany(Inspection, { foreignKey: 'entryId', as: 'inspections' });
  Reinspection.belongsTo(Entry, { foreignKey: 'entryId' });
  ParityReport.belongsTo(RaceClass, { foreignKey: 'classId' });
  ParityReport.belongsTo(Event, { foreignKey: 'eventId' });
  ProvisionalResults.belongsTo(RaceClass, { foreignKey: 'classId' });
  ProvisionalResults.belongsTo(Event, { foreignKey: 'eventId' });
  Protest.belongsTo(Event, { foreignKey: 'eventId' });
  Protest.belongsTo(User, { foreignKey: 'lodgedById', as: 'lodgedBy' });
  Protest.belongsTo(Entry, { foreignKey: 'againstEntryId', as: 'againstEntry' });
  Protest.belongsTo(ProvisionalResults, { foreignKey: 'againstResultId', as: 'againstResult' });
  Protest.hasMany(ProtestEvidence, { foreignKey: 'protestId', as: 'evidence' });
  ProtestEvidence.belongsTo(Protest, { foreignKey: 'protestId' });
  AuditEvent.belongsTo(Event, { foreignKey: 'eventId' });
  CustodyItem.belongsTo(Entry, { foreignKey: 'entryId' });
  CustodyItem.hasOne(CustodyRelease, { foreignKey: 'itemId', as: 'release' });
  OfficialInterest.hasOne(OfficialInterestWithdrawal, { foreignKey: 'interestId', as: 'withdrawal' });
  BoatComponent.belongsTo(Boat, { foreignKey: 'boatId' });
  Boat.hasMany(BoatComponent, { foreignKey: 'boatId', as: 'components' });
  BoatComponent.hasMany(ComponentEvent, { foreignKey: 'componentId', as: 'events' });
  SealBatch.belongsTo(Event, { foreignKey: 'eventId' });
  Seal.belongsTo(SealBatch, { foreignKey: 'batchId', as: 'batch' });
  Seal.hasMany(SealEvent, { foreignKey: 'sealId', as: 'events' });
  SealEvent.belongsTo(Seal, { foreignKey: 'sealId' });
  SealEvent.belongsTo(BoatComponent, { foreignKey: 'componentId', as: 'component' });
  BoatLogNote.belongsTo(User, { foreignKey: 'authorId', as: 'author' });

  return {
    User,
    Account,
    Session,
    VerificationToken,
    Organisation,
    OrganisationMember,
    Event,
    EventStaff,
    StaffInvitation,
    RaceClass,
    ClassRuleVersion,
    Boat,
    BoatDocument,
    BoatTag,
    BoatDeclarationVersion,
    Entry,
    PaymentEvent,
    Instrument,
    CalibrationCertificate,
    InstrumentCheck,
    Inspection,
    InspectionPhoto,
    Reinspection,
    ParityReport,
    ProvisionalResults,
    RunTime,
    Protest,
    ProtestEvidence,
    AuditEvent,
    CustodyItem,
    CustodyRelease,
    OfficialInterest,
    OfficialInterestWithdrawal,
    BoatComponent,
    ComponentEvent,
    DeclarationVersionComponent,
    SealBatch,
    Seal,
    SealEvent,
    BoatLogNote,
    MailOutbox,
    PumpCatalogueEntry,
    InspectionSlot,
    SlotBooking,
    SlotArrival,
    Incident,
    IncidentPhoto,
    CrewRequirement,
    EntryCrewMember,
    EntryGearItem,
    GearCheck,
    CrewSignOn,
  };
}

export type Models = ReturnType<typeof initModels>;
export {
  User,
  Account,
  Session,
  VerificationToken,
  Organisation,
  OrganisationMember,
  Event,
  EventStaff,
  StaffInvitation,
  RaceClass,
  ClassRuleVersion,
  Boat,
  BoatDocument,
  BoatTag,
  BoatDeclarationVersion,
  Entry,
  PaymentEvent,
  Instrument,
  CalibrationCertificate,
  InstrumentCheck,
  Inspection,
  InspectionPhoto,
  Reinspection,
  ParityReport,
  ProvisionalResults,
  RunTime,
  Protest,
  ProtestEvidence,
  AuditEvent,
  CustodyItem,
  CustodyRelease,
  OfficialInterest,
  OfficialInterestWithdrawal,
  BoatComponent,
  ComponentEvent,
  DeclarationVersionComponent,
  SealBatch,
  Seal,
  SealEvent,
  BoatLogNote,
  MailOutbox,
  PumpCatalogueEntry,
  InspectionSlot,
  SlotBooking,
  SlotArrival,
  Incident,
  IncidentPhoto,
};

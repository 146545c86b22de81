import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

// The people on an entry, their dated safety gear and the boat's, what a class or meeting accepts,
// and the dock's gear confirmations (append-only: migration 20261203011000).

/** The licence grades a class accepts (classId set) or the whole meeting accepts (classId null). */
export class CrewRequirement extends Model<InferAttributes<CrewRequirement>, InferCreationAttributes<CrewRequirement>> {
  declare id: CreationOptional<string>;
  declare eventId: string;
  declare classId: string | null;
  declare acceptedLicenceGrades: string[];
  declare navigatorRequired: boolean;
  declare updatedById: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

/** A person on an entry: a record the entrant keeps, or the entrant's own account (userId). */
export class EntryCrewMember extends Model<InferAttributes<EntryCrewMember>, InferCreationAttributes<EntryCrewMember>> {
  declare id: CreationOptional<string>;
  declare entryId: string;
  declare position: number;
  declare role: 'driver' | 'navigator' | 'reserve';
  declare userId: string | null;
  declare name: string;
  declare bornOn: string;
  declare licenceIssuedBy: string | null;
  declare licenceGrade: string | null;
  declare licenceNumber: string | null;
  declare licenceExpiresOn: string | null;
  declare medicalExpiresOn: string | null;
  declare guardianName: string | null;
  declare guardianConsentOn: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

/** A dated safety item: worn by a crew member (crewMemberId) or carried by the boat (null). */
export class EntryGearItem extends Model<InferAttributes<EntryGearItem>, InferCreationAttributes<EntryGearItem>> {
  declare id: CreationOptional<string>;
  declare entryId: string;
  declare crewMemberId: string | null;
  declare position: number;
  declare kind: string;
  declare standard: string;
  declare serial: string;
  declare dateKind: 'expires' | 'service_due';
  declare dueOn: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

/** What the dock found of one item on one meeting day, with the item as it read then. */
export class GearCheck extends Model<InferAttributes<GearCheck>, InferCreationAttributes<GearCheck>> {
  declare id: CreationOptional<string>;
  declare eventId: string;
  declare entryId: string;
  declare gearItemId: string;
  declare meetingDay: string;
  declare outcome: 'confirmed' | 'not_presented' | 'not_as_declared';
  declare kind: string;
  declare standard: string;
  declare serial: string;
  declare dueOn: string;
  declare note: CreationOptional<string>;
  declare checkedById: string;
  declare checkedAt: CreationOptional<Date>;
}

/** A person signed on with the officials on one meeting day, with the name and licence as they read then. */
export class CrewSignOn extends Model<InferAttributes<CrewSignOn>, InferCreationAttributes<CrewSignOn>> {
  declare id: CreationOptional<string>;
  declare eventId: string;
  declare entryId: string;
  declare crewMemberId: string;
  declare meetingDay: string;
  declare role: string;
  declare name: string;
  declare licenceNumber: string | null;
  declare signedOnById: string;
  declare signedOnAt: CreationOptional<Date>;
}

export function initCrew(sequelize: Sequelize) {
  const id = { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true };
  CrewRequirement.init(
    {
      id,
      eventId: { type: DataTypes.UUID, allowNull: false },
      classId: { type: DataTypes.UUID },
      acceptedLicenceGrades: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
      navigatorRequired: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      updatedById: { type: DataTypes.UUID, allowNull: false },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'crew_requirements', modelName: 'crewRequirement', underscored: true },
  );
  EntryCrewMember.init(
    {
      id,
      entryId: { type: DataTypes.UUID, allowNull: false },
      position: { type: DataTypes.INTEGER, allowNull: false },
      role: { type: DataTypes.STRING(10), allowNull: false },
      userId: { type: DataTypes.UUID },
      name: { type: DataTypes.STRING(120), allowNull: false },
      bornOn: { type: DataTypes.DATEONLY, allowNull: false },
      licenceIssuedBy: { type: DataTypes.STRING(80) },
      licenceGrade: { type: DataTypes.STRING(20) },
      licenceNumber: { type: DataTypes.STRING(40) },
      licenceExpiresOn: { type: DataTypes.DATEONLY },
      medicalExpiresOn: { type: DataTypes.DATEONLY },
      guardianName: { type: DataTypes.STRING(120) },
      guardianConsentOn: { type: DataTypes.DATEONLY },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'entry_crew_members', modelName: 'entryCrewMember', underscored: true },
  );
  EntryGearItem.init(
    {
      id,
      entryId: { type: DataTypes.UUID, allowNull: false },
      crewMemberId: { type: DataTypes.UUID },
      position: { type: DataTypes.INTEGER, allowNull: false },
      kind: { type: DataTypes.STRING(20), allowNull: false },
      standard: { type: DataTypes.STRING(60), allowNull: false },
      serial: { type: DataTypes.STRING(60), allowNull: false },
      dateKind: { type: DataTypes.STRING(12), allowNull: false },
      dueOn: { type: DataTypes.DATEONLY, allowNull: false },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'entry_gear_items', modelName: 'entryGearItem', underscored: true },
  );
  GearCheck.init(
    {
      id,
      eventId: { type: DataTypes.UUID, allowNull: false },
      entryId: { type: DataTypes.UUID, allowNull: false },
      gearItemId: { type: DataTypes.UUID, allowNull: false },
      meetingDay: { type: DataTypes.DATEONLY, allowNull: false },
      outcome: { type: DataTypes.STRING(16), allowNull: false },
      kind: { type: DataTypes.STRING(20), allowNull: false },
      standard: { type: DataTypes.STRING(60), allowNull: false },
      serial: { type: DataTypes.STRING(60), allowNull: false },
      dueOn: { type: DataTypes.DATEONLY, allowNull: false },
      note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      checkedById: { type: DataTypes.UUID, allowNull: false },
      checkedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    },
    { sequelize, tableName: 'gear_checks', modelName: 'gearCheck', underscored: true, timestamps: false },
  );
  CrewSignOn.init(
    {
      id,
      eventId: { type: DataTypes.UUID, allowNull: false },
      entryId: { type: DataTypes.UUID, allowNull: false },
      crewMemberId: { type: DataTypes.UUID, allowNull: false },
      meetingDay: { type: DataTypes.DATEONLY, allowNull: false },
      role: { type: DataTypes.STRING(10), allowNull: false },
      name: { type: DataTypes.STRING(120), allowNull: false },
      licenceNumber: { type: DataTypes.STRING(40) },
      signedOnById: { type: DataTypes.UUID, allowNull: false },
      signedOnAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    },
    { sequelize, tableName: 'crew_sign_ons', modelName: 'crewSignOn', underscored: true, timestamps: false },
  );
}

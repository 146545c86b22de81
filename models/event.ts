import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

import type { EventStatus, EventStaffRole } from './shapes/event';
import type { SeriesOfficialRole } from './shapes/series';
export type { EventStatus, EventStaffRole };

// A race meeting run by an organisation.
export class Event extends Model<InferAttributes<Event>, InferCreationAttributes<Event>> {
  declare id: CreationOptional<string>;
  declare organisationId: string;
  declare name: string;
  declare slug: string;
  declare venue: string;
  declare startsOn: string;
  declare endsOn: string;
  declare timeZone: string;
  declare status: CreationOptional<EventStatus>;
  declare waterKind: CreationOptional<'fresh' | 'sea'>;
  declare waterTemperatureC: CreationOptional<number>;
  declare waterDensityKgM3: CreationOptional<number | null>;
  declare protestWindowMinutes: CreationOptional<number>;
  declare appealNoticeMinutes: CreationOptional<number>;
  declare currency: CreationOptional<string>;
  declare entryFeeMinor: CreationOptional<number>;
  declare protestFeeMinor: CreationOptional<number>;
  /** The meeting lets one boat enter several classes (each inspected under its own class's rules). */
  declare severalClassesPerBoat: CreationOptional<boolean>;
  declare appealFeeMinor: CreationOptional<number>; // notice of appeal to the governing body's appeal body
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

// A person's staff role at one event (a scrutineer here may be an entrant elsewhere).
export class EventStaff extends Model<InferAttributes<EventStaff>, InferCreationAttributes<EventStaff>> {
  declare id: CreationOptional<string>;
  declare eventId: string;
  declare userId: string;
  declare role: EventStaffRole;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

// An e-mailed invitation to a meeting's staff (eventId) or to a series role (seriesId), exactly one of the two;
// only the token's SHA-256 is stored.
export class StaffInvitation extends Model<InferAttributes<StaffInvitation>, InferCreationAttributes<StaffInvitation>> {
  declare id: CreationOptional<string>;
  declare eventId: CreationOptional<string | null>;
  declare seriesId: CreationOptional<string | null>;
  declare email: string;
  declare role: EventStaffRole | SeriesOfficialRole;
  declare tokenHash: string;
  declare invitedById: string;
  declare expiresAt: Date;
  declare acceptedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initEvents(sequelize: Sequelize) {
  Event.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      organisationId: { type: DataTypes.UUID, allowNull: false },
      name: { type: DataTypes.STRING, allowNull: false },
      slug: { type: DataTypes.STRING, allowNull: false, unique: true },
      venue: { type: DataTypes.STRING, allowNull: false },
      startsOn: { type: DataTypes.DATEONLY, allowNull: false },
      endsOn: { type: DataTypes.DATEONLY, allowNull: false },
      timeZone: { type: DataTypes.STRING, allowNull: false },
      status: { type: DataTypes.STRING, allowNull: false, defaultValue: 'draft' },
      waterKind: { type: DataTypes.STRING, allowNull: false, defaultValue: 'fresh' },
      waterTemperatureC: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 15 },
      waterDensityKgM3: { type: DataTypes.DOUBLE },
      protestWindowMinutes: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 30 },
      appealNoticeMinutes: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 60 },
      currency: { type: DataTypes.STRING(3), allowNull: false, defaultValue: 'NZD' },
      entryFeeMinor: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      protestFeeMinor: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      severalClassesPerBoat: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      appealFeeMinor: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'events', modelName: 'event', underscored: true },
  );
  EventStaff.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      eventId: { type: DataTypes.UUID, allowNull: false },
      userId: { type: DataTypes.UUID, allowNull: false },
      role: { type: DataTypes.STRING, allowNull: false },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'event_staff', modelName: 'eventStaff', underscored: true },
  );
  StaffInvitation.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      eventId: { type: DataTypes.UUID },
      seriesId: { type: DataTypes.UUID },
      email: { type: DataTypes.STRING, allowNull: false },
      role: { type: DataTypes.STRING, allowNull: false },
      tokenHash: { type: DataTypes.STRING, allowNull: false, unique: true },
      invitedById: { type: DataTypes.UUID, allowNull: false },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      acceptedAt: { type: DataTypes.DATE },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'staff_invitations', modelName: 'staffInvitation', underscored: true },
  );
}

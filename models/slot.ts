import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

// Scrutineering slots (a time at a bay for one class), the bookings of entries into them (append-only:
// a re-booking supersedes), check-ins at the dock (append-only; a walk-in has no booking) and the
// reminders queued for bookings (once each). Migration 20261203012000.
export class InspectionSlot extends Model<InferAttributes<InspectionSlot>, InferCreationAttributes<InspectionSlot>> {
  declare id: CreationOptional<string>;
  declare eventId: string;
  declare classId: string;
  declare bay: string;
  declare startsAt: Date;
  declare endsAt: Date;
  declare capacity: number;
  declare graceMinutes: number;
  declare createdById: string;
  declare createdAt: CreationOptional<Date>;
}

export class SlotBooking extends Model<InferAttributes<SlotBooking>, InferCreationAttributes<SlotBooking>> {
  declare id: CreationOptional<string>;
  declare eventId: string;
  declare slotId: string;
  declare entryId: string;
  declare bookedById: string;
  declare supersedesId: string | null;
  declare createdAt: CreationOptional<Date>;
}

export class SlotArrival extends Model<InferAttributes<SlotArrival>, InferCreationAttributes<SlotArrival>> {
  declare id: CreationOptional<string>;
  declare eventId: string;
  declare entryId: string;
  declare bookingId: string | null;
  declare clientKey: string;
  declare meetingDay: string;
  declare bay: string;
  declare arrivedAt: Date;
  declare recordedById: string;
  declare createdAt: CreationOptional<Date>;
}

export function initSlots(sequelize: Sequelize) {
  const opts = (tableName: string, modelName: string) => ({
    sequelize,
    tableName,
    modelName,
    underscored: true,
    timestamps: false,
  });
  InspectionSlot.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      eventId: { type: DataTypes.UUID, allowNull: false },
      classId: { type: DataTypes.UUID, allowNull: false },
      bay: { type: DataTypes.STRING(40), allowNull: false },
      startsAt: { type: DataTypes.DATE, allowNull: false },
      endsAt: { type: DataTypes.DATE, allowNull: false },
      capacity: { type: DataTypes.INTEGER, allowNull: false },
      graceMinutes: { type: DataTypes.INTEGER, allowNull: false },
      createdById: { type: DataTypes.UUID, allowNull: false },
      createdAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    },
    opts('inspection_slots', 'inspectionSlot'),
  );
  SlotBooking.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      eventId: { type: DataTypes.UUID, allowNull: false },
      slotId: { type: DataTypes.UUID, allowNull: false },
      entryId: { type: DataTypes.UUID, allowNull: false },
      bookedById: { type: DataTypes.UUID, allowNull: false },
      supersedesId: { type: DataTypes.UUID, allowNull: true },
      createdAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    },
    opts('slot_bookings', 'slotBooking'),
  );
  SlotArrival.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      eventId: { type: DataTypes.UUID, allowNull: false },
      entryId: { type: DataTypes.UUID, allowNull: false },
      bookingId: { type: DataTypes.UUID, allowNull: true },
      clientKey: { type: DataTypes.UUID, allowNull: false },
      meetingDay: { type: DataTypes.DATEONLY, allowNull: false },
      bay: { type: DataTypes.STRING(40), allowNull: false },
      arrivedAt: { type: DataTypes.DATE, allowNull: false },
      recordedById: { type: DataTypes.UUID, allowNull: false },
      createdAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    },
    opts('slot_arrivals', 'slotArrival'),
  );
}

import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

export type EntryStatus = 'awaiting_payment' | 'entered' | 'withdrawn' | 'cancelled';
export type InspectionResult = 'conforms' | 'does_not_conform' | 'inconclusive';

// A boat entered in one class at one event. Marked paid only by a verified payment webhook.
export class Entry extends Model<InferAttributes<Entry>, InferCreationAttributes<Entry>> {
  declare id: CreationOptional<string>;
  declare eventId: string;
  declare classId: string;
  declare boatId: string;
  declare entrantId: string;
  declare raceNumber: number;
  declare status: CreationOptional<EntryStatus>;
  declare inspectionResult: CreationOptional<InspectionResult | null>;
  declare feeMinor: number;
  declare currency: string;
  declare checkoutSessionId: CreationOptional<string | null>;
  declare paymentIntentId: CreationOptional<string | null>;
  declare paidAt: CreationOptional<Date | null>;
  declare refundedAt: CreationOptional<Date | null>;
  declare refundId: CreationOptional<string | null>;
  declare cancelledReason: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

// A payment webhook event already applied (its id), so a replay changes nothing.
export class PaymentEvent extends Model<InferAttributes<PaymentEvent>, InferCreationAttributes<PaymentEvent>> {
  declare id: string;
  declare type: string;
  declare receivedAt: CreationOptional<Date>;
}

export function initEntries(sequelize: Sequelize) {
  Entry.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      eventId: { type: DataTypes.UUID, allowNull: false },
      classId: { type: DataTypes.UUID, allowNull: false },
      boatId: { type: DataTypes.UUID, allowNull: false },
      entrantId: { type: DataTypes.UUID, allowNull: false },
      raceNumber: { type: DataTypes.INTEGER, allowNull: false },
      status: { type: DataTypes.STRING, allowNull: false, defaultValue: 'awaiting_payment' },
      inspectionResult: { type: DataTypes.STRING },
      feeMinor: { type: DataTypes.INTEGER, allowNull: false },
      currency: { type: DataTypes.STRING(3), allowNull: false },
      checkoutSessionId: { type: DataTypes.STRING, unique: true },
      paymentIntentId: { type: DataTypes.STRING },
      paidAt: { type: DataTypes.DATE },
      refundedAt: { type: DataTypes.DATE },
      refundId: { type: DataTypes.STRING },
      cancelledReason: { type: DataTypes.TEXT },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'entries', modelName: 'entry', underscored: true },
  );
  PaymentEvent.init(
    {
      id: { type: DataTypes.STRING, primaryKey: true },
      type: { type: DataTypes.STRING, allowNull: false },
      receivedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    },
    { sequelize, tableName: 'payment_events', modelName: 'paymentEvent', underscored: true, timestamps: false },
  );
}

import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { StoredMeasurements, StoredResults } from './shapes/inspection-record';

export type InspectionVerdict = 'conforms' | 'does_not_conform' | 'inconclusive';
export type InspectionKind = 'pre_race' | 'post_race' | 'protest' | 'spot_check';

// A measuring instrument on an event's list, with what its uncertainty budget needs.
export class Instrument extends Model<InferAttributes<Instrument>, InferCreationAttributes<Instrument>> {
  declare id: CreationOptional<string>;
  declare eventId: string;
  declare name: string;
  declare quantity: 'length' | 'mass';
  declare errorLimit: CreationOptional<number | null>;
  declare resolution: CreationOptional<number | null>;
  declare expandedUncertainty: CreationOptional<number | null>;
  /** What kind of instrument (caliper, bore gauge, …), its serial, measuring range and material; null on older rows. */
  declare instrumentType: CreationOptional<string | null>;
  declare serial: CreationOptional<string | null>;
  declare rangeMin: CreationOptional<number | null>;
  declare rangeMax: CreationOptional<number | null>;
  declare material: CreationOptional<string | null>;
  declare retiredAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

// One inspection record. Append-only: the database refuses updates and deletes.
export class Inspection extends Model<InferAttributes<Inspection>, InferCreationAttributes<Inspection>> {
  declare id: CreationOptional<string>;
  declare eventId: string;
  declare entryId: string;
  declare boatId: string;
  declare classId: string;
  declare ruleVersionId: string;
  declare kind: CreationOptional<InspectionKind>;
  declare recordedById: string;
  declare device: CreationOptional<string>;
  declare idempotencyKey: string;
  declare capturedAt: Date;
  declare receivedAt: CreationOptional<Date>;
  declare supersedesId: CreationOptional<string | null>;
  declare correctionReason: CreationOptional<string | null>;
  declare reinspectionId: CreationOptional<string | null>;
  /** The stored record (models/shapes/inspection-record.ts): built by buildInspectionRecord, never edited. */
  declare measurements: StoredMeasurements;
  declare results: StoredResults;
  declare overallResult: InspectionVerdict;
  declare notes: CreationOptional<string>;
}

export class InspectionPhoto extends Model<InferAttributes<InspectionPhoto>, InferCreationAttributes<InspectionPhoto>> {
  declare id: CreationOptional<string>;
  declare inspectionId: string;
  declare objectKey: string;
  declare contentType: string;
  declare sizeBytes: number;
  declare sha256: string;
  declare createdAt: CreationOptional<Date>;
}

// A task to inspect an entry again (after a race, or ordered by the stewards).
export class Reinspection extends Model<InferAttributes<Reinspection>, InferCreationAttributes<Reinspection>> {
  declare id: CreationOptional<string>;
  declare eventId: string;
  declare entryId: string;
  declare reason: string;
  declare requestedById: string;
  declare protestId: CreationOptional<string | null>;
  declare inspectionId: CreationOptional<string | null>;
  /** The declaration version whose change after an inspection asked for this task, if any. */
  declare declarationVersionId: CreationOptional<string | null>;
  declare doneAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initInspections(sequelize: Sequelize) {
  Instrument.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      eventId: { type: DataTypes.UUID, allowNull: false },
      name: { type: DataTypes.STRING, allowNull: false },
      quantity: { type: DataTypes.STRING, allowNull: false },
      errorLimit: { type: DataTypes.DOUBLE },
      resolution: { type: DataTypes.DOUBLE },
      expandedUncertainty: { type: DataTypes.DOUBLE },
      instrumentType: { type: DataTypes.STRING(40) },
      serial: { type: DataTypes.STRING(80) },
      rangeMin: { type: DataTypes.DOUBLE },
      rangeMax: { type: DataTypes.DOUBLE },
      material: { type: DataTypes.STRING(40) },
      retiredAt: { type: DataTypes.DATE },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'instruments', modelName: 'instrument', underscored: true },
  );
  Inspection.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      eventId: { type: DataTypes.UUID, allowNull: false },
      entryId: { type: DataTypes.UUID, allowNull: false },
      boatId: { type: DataTypes.UUID, allowNull: false },
      classId: { type: DataTypes.UUID, allowNull: false },
      ruleVersionId: { type: DataTypes.UUID, allowNull: false },
      kind: { type: DataTypes.STRING, allowNull: false, defaultValue: 'pre_race' },
      recordedById: { type: DataTypes.UUID, allowNull: false },
      device: { type: DataTypes.STRING, allowNull: false, defaultValue: '' },
      idempotencyKey: { type: DataTypes.STRING, allowNull: false, unique: true },
      capturedAt: { type: DataTypes.DATE, allowNull: false },
      receivedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      supersedesId: { type: DataTypes.UUID },
      correctionReason: { type: DataTypes.TEXT },
      reinspectionId: { type: DataTypes.UUID },
      measurements: { type: DataTypes.JSONB, allowNull: false },
      results: { type: DataTypes.JSONB, allowNull: false },
      overallResult: { type: DataTypes.STRING, allowNull: false },
      notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    },
    { sequelize, tableName: 'inspections', modelName: 'inspection', underscored: true, timestamps: false },
  );
  InspectionPhoto.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      inspectionId: { type: DataTypes.UUID, allowNull: false },
      objectKey: { type: DataTypes.STRING, allowNull: false, unique: true },
      contentType: { type: DataTypes.STRING, allowNull: false },
      sizeBytes: {
        type: DataTypes.BIGINT,
        allowNull: false,
        get() {
          return Number(this.getDataValue('sizeBytes'));
        },
      },
      sha256: { type: DataTypes.STRING(64), allowNull: false },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'inspection_photos', modelName: 'inspectionPhoto', underscored: true, updatedAt: false },
  );
  Reinspection.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      eventId: { type: DataTypes.UUID, allowNull: false },
      entryId: { type: DataTypes.UUID, allowNull: false },
      reason: { type: DataTypes.TEXT, allowNull: false },
      requestedById: { type: DataTypes.UUID, allowNull: false },
      protestId: { type: DataTypes.UUID },
      inspectionId: { type: DataTypes.UUID },
      declarationVersionId: { type: DataTypes.UUID },
      doneAt: { type: DataTypes.DATE },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'reinspections', modelName: 'reinspection', underscored: true },
  );
}

import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { StoredBoatPerformance } from './shapes/boat-performance';

export type PowerEvidence = 'dyno_sheet' | 'maker_rating' | 'none';

// A boat and its owner's declared specification (free text as the owner writes it, plus figures).
export class Boat extends Model<InferAttributes<Boat>, InferCreationAttributes<Boat>> {
  declare id: CreationOptional<string>;
  declare ownerId: string;
  declare name: string;
  declare hullNumber: CreationOptional<string>;
  declare hullDescription: CreationOptional<string>;
  declare pumpDescription: CreationOptional<string>;
  declare impellerDescription: CreationOptional<string>;
  declare declaredNozzleMm: number;
  declare declaredNozzleToleranceMm: CreationOptional<number>;
  declare engineDescription: CreationOptional<string>;
  declare declaredPowerKw: number;
  declare powerEvidence: CreationOptional<PowerEvidence>;
  declare displacementL: CreationOptional<number | null>;
  declare declaredWeightKg: CreationOptional<number | null>;
  /** Declared engine curve, pump characteristic and suction data (null: none declared). */
  declare declaredPerformance: CreationOptional<StoredBoatPerformance | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

// One version of a boat's declaration (append-only: an edit is the next version, with who and when).
export class BoatDeclarationVersion extends Model<
  InferAttributes<BoatDeclarationVersion>,
  InferCreationAttributes<BoatDeclarationVersion>
> {
  declare id: CreationOptional<string>;
  declare boatId: string;
  declare version: number;
  declare hullDescription: string;
  declare pumpDescription: string;
  declare impellerDescription: string;
  declare declaredNozzleMm: number;
  declare declaredNozzleToleranceMm: number;
  declare engineDescription: string;
  declare declaredPowerKw: number;
  declare powerEvidence: PowerEvidence;
  declare displacementL: number | null;
  declare declaredWeightKg: number | null;
  declare declaredPerformance: CreationOptional<StoredBoatPerformance | null>;
  declare createdById: string;
  declare createdAt: CreationOptional<Date>;
}

// A file attached to a boat's declaration; the bytes live in object storage under objectKey.
export class BoatDocument extends Model<InferAttributes<BoatDocument>, InferCreationAttributes<BoatDocument>> {
  declare id: CreationOptional<string>;
  declare boatId: string;
  declare uploadedById: string;
  declare kind: string;
  declare objectKey: string;
  declare fileName: string;
  declare contentType: string;
  declare sizeBytes: number;
  declare sha256: string;
  declare createdAt: CreationOptional<Date>;
}

// A QR tag token; reissuing retires the old one (at most one current tag per boat).
export class BoatTag extends Model<InferAttributes<BoatTag>, InferCreationAttributes<BoatTag>> {
  declare id: CreationOptional<string>;
  declare boatId: string;
  declare token: string;
  declare issuedAt: CreationOptional<Date>;
  declare retiredAt: CreationOptional<Date | null>;
}

export function initBoats(sequelize: Sequelize) {
  Boat.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      ownerId: { type: DataTypes.UUID, allowNull: false },
      name: { type: DataTypes.STRING, allowNull: false },
      hullNumber: { type: DataTypes.STRING, allowNull: false, defaultValue: '' },
      hullDescription: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      pumpDescription: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      impellerDescription: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      declaredNozzleMm: { type: DataTypes.DOUBLE, allowNull: false },
      declaredNozzleToleranceMm: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0.1 },
      engineDescription: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      declaredPowerKw: { type: DataTypes.DOUBLE, allowNull: false },
      powerEvidence: { type: DataTypes.STRING, allowNull: false, defaultValue: 'none' },
      displacementL: { type: DataTypes.DOUBLE },
      declaredWeightKg: { type: DataTypes.DOUBLE },
      declaredPerformance: { type: DataTypes.JSONB },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'boats', modelName: 'boat', underscored: true },
  );
  BoatDeclarationVersion.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      boatId: { type: DataTypes.UUID, allowNull: false },
      version: { type: DataTypes.INTEGER, allowNull: false },
      hullDescription: { type: DataTypes.TEXT, allowNull: false },
      pumpDescription: { type: DataTypes.TEXT, allowNull: false },
      impellerDescription: { type: DataTypes.TEXT, allowNull: false },
      declaredNozzleMm: { type: DataTypes.DOUBLE, allowNull: false },
      declaredNozzleToleranceMm: { type: DataTypes.DOUBLE, allowNull: false },
      engineDescription: { type: DataTypes.TEXT, allowNull: false },
      declaredPowerKw: { type: DataTypes.DOUBLE, allowNull: false },
      powerEvidence: { type: DataTypes.STRING, allowNull: false },
      displacementL: { type: DataTypes.DOUBLE },
      declaredWeightKg: { type: DataTypes.DOUBLE },
      declaredPerformance: { type: DataTypes.JSONB },
      createdById: { type: DataTypes.UUID, allowNull: false },
      createdAt: DataTypes.DATE,
    },
    {
      sequelize,
      tableName: 'boat_declaration_versions',
      modelName: 'boatDeclarationVersion',
      underscored: true,
      updatedAt: false,
    },
  );
  BoatDocument.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      boatId: { type: DataTypes.UUID, allowNull: false },
      uploadedById: { type: DataTypes.UUID, allowNull: false },
      kind: { type: DataTypes.STRING, allowNull: false },
      objectKey: { type: DataTypes.STRING, allowNull: false, unique: true },
      fileName: { type: DataTypes.STRING, allowNull: false },
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
    { sequelize, tableName: 'boat_documents', modelName: 'boatDocument', underscored: true, updatedAt: false },
  );
  BoatTag.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      boatId: { type: DataTypes.UUID, allowNull: false },
      token: { type: DataTypes.STRING, allowNull: false, unique: true },
      issuedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      retiredAt: { type: DataTypes.DATE },
    },
    { sequelize, tableName: 'boat_tags', modelName: 'boatTag', underscored: true, timestamps: false },
  );
}

import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { StoredPumpCurvePoint } from './shapes/boat-performance';

// A maker's impeller model and trim with its curve, entered once by a meeting's organiser for every
// entrant (append-only: migrations/20261203008000-declared-engine-pump-curves.js).
export class PumpCatalogueEntry extends Model<
  InferAttributes<PumpCatalogueEntry>,
  InferCreationAttributes<PumpCatalogueEntry>
> {
  declare id: CreationOptional<string>;
  declare eventId: string;
  declare maker: string;
  declare model: string;
  declare trimCode: CreationOptional<string>;
  declare impellerDiameterMm: number;
  declare curve: StoredPumpCurvePoint[];
  declare createdById: string;
  declare createdAt: CreationOptional<Date>;
}

export function initPumpCatalogue(sequelize: Sequelize) {
  PumpCatalogueEntry.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      eventId: { type: DataTypes.UUID, allowNull: false },
      maker: { type: DataTypes.STRING(80), allowNull: false },
      model: { type: DataTypes.STRING(80), allowNull: false },
      trimCode: { type: DataTypes.STRING(40), allowNull: false, defaultValue: '' },
      impellerDiameterMm: { type: DataTypes.DOUBLE, allowNull: false },
      curve: { type: DataTypes.JSONB, allowNull: false },
      createdById: { type: DataTypes.UUID, allowNull: false },
      createdAt: DataTypes.DATE,
    },
    {
      sequelize,
      tableName: 'pump_catalogue_entries',
      modelName: 'pumpCatalogueEntry',
      underscored: true,
      updatedAt: false,
    },
  );
}

import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

// A part held by the officials (append-only), and its release (append-only, at most one per item).
export class CustodyItem extends Model<InferAttributes<CustodyItem>, InferCreationAttributes<CustodyItem>> {
  declare id: CreationOptional<string>;
  declare eventId: string;
  declare entryId: string;
  declare protestId: CreationOptional<string | null>;
  declare description: string;
  declare sealNumber: CreationOptional<string | null>;
  declare takenById: string;
  declare takenAt: CreationOptional<Date>;
}

export class CustodyRelease extends Model<InferAttributes<CustodyRelease>, InferCreationAttributes<CustodyRelease>> {
  declare id: CreationOptional<string>;
  declare itemId: string;
  declare releasedById: string;
  declare releasedTo: string;
  declare note: CreationOptional<string>;
  declare releasedAt: CreationOptional<Date>;
}

export function initCustody(sequelize: Sequelize) {
  CustodyItem.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      eventId: { type: DataTypes.UUID, allowNull: false },
      entryId: { type: DataTypes.UUID, allowNull: false },
      protestId: { type: DataTypes.UUID },
      description: { type: DataTypes.TEXT, allowNull: false },
      sealNumber: { type: DataTypes.STRING },
      takenById: { type: DataTypes.UUID, allowNull: false },
      takenAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    },
    { sequelize, tableName: 'custody_items', modelName: 'custodyItem', underscored: true, timestamps: false },
  );
  CustodyRelease.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      itemId: { type: DataTypes.UUID, allowNull: false, unique: true },
      releasedById: { type: DataTypes.UUID, allowNull: false },
      releasedTo: { type: DataTypes.TEXT, allowNull: false },
      note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      releasedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    },
    { sequelize, tableName: 'custody_releases', modelName: 'custodyRelease', underscored: true, timestamps: false },
  );
}

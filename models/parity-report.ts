import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { StoredReportInputs, StoredReportResults } from './shapes/parity-report';

// A published parity report version; append-only (a trigger refuses updates and deletes).
export class ParityReport extends Model<InferAttributes<ParityReport>, InferCreationAttributes<ParityReport>> {
  declare id: CreationOptional<string>;
  declare eventId: string;
  declare classId: string;
  declare number: number;
  declare publicId: string;
  declare ruleVersionId: string;
  declare note: CreationOptional<string>;
  declare inputs: StoredReportInputs;
  declare results: StoredReportResults;
  declare publishedById: string;
  declare publishedAt: CreationOptional<Date>;
}

export function initParityReports(sequelize: Sequelize) {
  ParityReport.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      eventId: { type: DataTypes.UUID, allowNull: false },
      classId: { type: DataTypes.UUID, allowNull: false },
      number: { type: DataTypes.INTEGER, allowNull: false },
      publicId: { type: DataTypes.STRING, allowNull: false, unique: true },
      ruleVersionId: { type: DataTypes.UUID, allowNull: false },
      note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      inputs: { type: DataTypes.JSONB, allowNull: false },
      results: { type: DataTypes.JSONB, allowNull: false },
      publishedById: { type: DataTypes.UUID, allowNull: false },
      publishedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    },
    { sequelize, tableName: 'parity_reports', modelName: 'parityReport', underscored: true, timestamps: false },
  );
}

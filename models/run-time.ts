import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

// One run of a boat over a course, from the timing sheet. Append-only: a correction is a new row that
// supersedes the current one (migration 20261203009000).
export class RunTime extends Model<InferAttributes<RunTime>, InferCreationAttributes<RunTime>> {
  declare id: CreationOptional<string>;
  declare eventId: string;
  declare classId: string;
  declare entryId: string;
  declare raceNumber: number;
  declare runLabel: string;
  declare courseLengthM: number;
  declare elapsedS: number;
  declare trapSpeedMs: number | null;
  declare gpsTopSpeedMs: number | null;
  declare rpm: number | null;
  declare conditions: CreationOptional<string>;
  declare source: 'csv' | 'form';
  declare supersedesId: string | null;
  declare recordedById: string;
  declare recordedAt: CreationOptional<Date>;
}

export function initRunTimes(sequelize: Sequelize) {
  RunTime.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      eventId: { type: DataTypes.UUID, allowNull: false },
      classId: { type: DataTypes.UUID, allowNull: false },
      entryId: { type: DataTypes.UUID, allowNull: false },
      raceNumber: { type: DataTypes.INTEGER, allowNull: false },
      runLabel: { type: DataTypes.STRING(20), allowNull: false },
      courseLengthM: { type: DataTypes.DOUBLE, allowNull: false },
      elapsedS: { type: DataTypes.DOUBLE, allowNull: false },
      trapSpeedMs: { type: DataTypes.DOUBLE, allowNull: true },
      gpsTopSpeedMs: { type: DataTypes.DOUBLE, allowNull: true },
      rpm: { type: DataTypes.INTEGER, allowNull: true },
      conditions: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      source: { type: DataTypes.STRING(10), allowNull: false },
      supersedesId: { type: DataTypes.UUID, allowNull: true },
      recordedById: { type: DataTypes.UUID, allowNull: false },
      recordedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    },
    { sequelize, tableName: 'run_times', modelName: 'runTime', underscored: true, timestamps: false },
  );
}

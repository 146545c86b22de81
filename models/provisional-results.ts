import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

// status: set on a version written by the stewards or the appeal body for a boat disqualified from the
// meeting or excluded (listed after the classified boats, its position only its place in the list).
export type ResultRow = { position: number; raceNumber: number; entryId: string; status?: 'dsq' | 'excluded' };
/** A penalty in force beside the row it touches, as the version was written (the reason shown with the row). */
export type ResultAmendment = {
  entryId: string;
  penaltyId: string;
  code: string;
  kind: string;
  amount: number | null;
  label: string;
  reason: string;
  appealId: string | null; // the appeal whose decision set this penalty (an amended decision)
};
export type ResultsSource = 'form' | 'csv' | 'stewards' | 'appeal';

// One published version of a class's provisional results. Append-only: a correction is a new version.
export class ProvisionalResults extends Model<
  InferAttributes<ProvisionalResults>,
  InferCreationAttributes<ProvisionalResults>
> {
  declare id: CreationOptional<string>;
  declare eventId: string;
  declare classId: string;
  declare version: number;
  declare publishedAt: CreationOptional<Date>;
  declare publishedById: string;
  declare rows: ResultRow[];
  declare changedEntryIds: CreationOptional<string[]>;
  declare source: ResultsSource;
  declare amendments: CreationOptional<ResultAmendment[]>;
  declare note: CreationOptional<string>;
}

export function initProvisionalResults(sequelize: Sequelize) {
  ProvisionalResults.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      eventId: { type: DataTypes.UUID, allowNull: false },
      classId: { type: DataTypes.UUID, allowNull: false },
      version: { type: DataTypes.INTEGER, allowNull: false },
      publishedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      publishedById: { type: DataTypes.UUID, allowNull: false },
      rows: { type: DataTypes.JSONB, allowNull: false },
      changedEntryIds: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
      source: { type: DataTypes.STRING, allowNull: false },
      amendments: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
      note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    },
    {
      sequelize,
      tableName: 'provisional_results',
      modelName: 'provisionalResults',
      underscored: true,
      timestamps: false,
    },
  );
}

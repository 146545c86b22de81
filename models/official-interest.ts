import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

export type InterestSubjectKind = 'boat' | 'entrant' | 'team';

// An official's declared interest at one meeting (append-only), and its withdrawal (append-only, at most one).
export class OfficialInterest extends Model<
  InferAttributes<OfficialInterest>,
  InferCreationAttributes<OfficialInterest>
> {
  declare id: CreationOptional<string>;
  declare eventId: string;
  declare officialId: string;
  declare subjectKind: InterestSubjectKind;
  declare boatId: CreationOptional<string | null>;
  declare entrantId: CreationOptional<string | null>;
  declare teamName: CreationOptional<string | null>;
  declare statement: string;
  declare declaredAt: CreationOptional<Date>;
}

export class OfficialInterestWithdrawal extends Model<
  InferAttributes<OfficialInterestWithdrawal>,
  InferCreationAttributes<OfficialInterestWithdrawal>
> {
  declare id: CreationOptional<string>;
  declare interestId: string;
  declare withdrawnById: string;
  declare reason: CreationOptional<string>;
  declare withdrawnAt: CreationOptional<Date>;
}

export function initOfficialInterests(sequelize: Sequelize) {
  OfficialInterest.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      eventId: { type: DataTypes.UUID, allowNull: false },
      officialId: { type: DataTypes.UUID, allowNull: false },
      subjectKind: { type: DataTypes.STRING, allowNull: false },
      boatId: { type: DataTypes.UUID },
      entrantId: { type: DataTypes.UUID },
      teamName: { type: DataTypes.TEXT },
      statement: { type: DataTypes.TEXT, allowNull: false },
      declaredAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    },
    { sequelize, tableName: 'official_interests', modelName: 'officialInterest', underscored: true, timestamps: false },
  );
  OfficialInterestWithdrawal.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      interestId: { type: DataTypes.UUID, allowNull: false, unique: true },
      withdrawnById: { type: DataTypes.UUID, allowNull: false },
      reason: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      withdrawnAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    },
    {
      sequelize,
      tableName: 'official_interest_withdrawals',
      modelName: 'officialInterestWithdrawal',
      underscored: true,
      timestamps: false,
    },
  );
}

import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

export type ProtestStatus =
  'awaiting_fee' | 'lodged' | 'accepted' | 'rejected' | 'hearing_scheduled' | 'upheld' | 'dismissed' | 'withdrawn';
export type RejectionCode = 'out_of_time' | 'no_fee' | 'wrong_form';
export type EvidenceKind = 'file' | 'inspection_link' | 'note';

// A protest by one entrant, against an entry or a results version, with its fee and decision.
export class Protest extends Model<InferAttributes<Protest>, InferCreationAttributes<Protest>> {
  declare id: CreationOptional<string>;
  declare eventId: string;
  declare lodgedById: string;
  declare againstEntryId: string | null;
  declare againstResultId: string | null;
  declare resultsVersionId: string | null;
  declare matterKey: string;
  declare ruleReference: string;
  declare grounds: string;
  declare requestedChecks: CreationOptional<string[]>;
  declare status: CreationOptional<ProtestStatus>;
  declare feeMinor: number;
  declare currency: string;
  declare checkoutSessionId: CreationOptional<string | null>;
  declare paymentIntentId: CreationOptional<string | null>;
  declare paidAt: CreationOptional<Date | null>;
  declare refundId: CreationOptional<string | null>;
  declare refundedAt: CreationOptional<Date | null>;
  declare windowDeadline: Date;
  declare rejectionCode: CreationOptional<RejectionCode | null>;
  declare hearingAt: CreationOptional<Date | null>;
  declare hearingPlace: CreationOptional<string | null>;
  declare decisionReasons: CreationOptional<string | null>;
  declare penalty: CreationOptional<string | null>;
  declare decidedAt: CreationOptional<Date | null>;
  declare decidedByIds: CreationOptional<string[]>;
  declare decidedByNames: CreationOptional<string[]>; // as they were named when they decided
  declare appealDeadline: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

// One piece of evidence for a protest. Append-only: never replaced or deleted.
export class ProtestEvidence extends Model<InferAttributes<ProtestEvidence>, InferCreationAttributes<ProtestEvidence>> {
  declare id: CreationOptional<string>;
  declare protestId: string;
  declare addedById: string;
  declare kind: EvidenceKind;
  declare objectKey: CreationOptional<string | null>;
  declare fileName: CreationOptional<string | null>;
  declare contentType: CreationOptional<string | null>;
  declare sizeBytes: CreationOptional<number | null>;
  declare sha256: CreationOptional<string | null>;
  declare inspectionId: CreationOptional<string | null>;
  declare note: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
}

export function initProtests(sequelize: Sequelize) {
  Protest.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      eventId: { type: DataTypes.UUID, allowNull: false },
      lodgedById: { type: DataTypes.UUID, allowNull: false },
      againstEntryId: { type: DataTypes.UUID },
      againstResultId: { type: DataTypes.UUID },
      resultsVersionId: { type: DataTypes.UUID },
      matterKey: { type: DataTypes.STRING, allowNull: false },
      ruleReference: { type: DataTypes.STRING, allowNull: false },
      grounds: { type: DataTypes.TEXT, allowNull: false },
      requestedChecks: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
      status: { type: DataTypes.STRING, allowNull: false, defaultValue: 'awaiting_fee' },
      feeMinor: { type: DataTypes.INTEGER, allowNull: false },
      currency: { type: DataTypes.STRING(3), allowNull: false },
      checkoutSessionId: { type: DataTypes.STRING, unique: true },
      paymentIntentId: { type: DataTypes.STRING },
      paidAt: { type: DataTypes.DATE },
      refundId: { type: DataTypes.STRING },
      refundedAt: { type: DataTypes.DATE },
      windowDeadline: { type: DataTypes.DATE, allowNull: false },
      rejectionCode: { type: DataTypes.STRING },
      hearingAt: { type: DataTypes.DATE },
      hearingPlace: { type: DataTypes.STRING },
      decisionReasons: { type: DataTypes.TEXT },
      penalty: { type: DataTypes.TEXT },
      decidedAt: { type: DataTypes.DATE },
      decidedByIds: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
      decidedByNames: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
      appealDeadline: { type: DataTypes.DATE },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'protests', modelName: 'protest', underscored: true },
  );
  ProtestEvidence.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      protestId: { type: DataTypes.UUID, allowNull: false },
      addedById: { type: DataTypes.UUID, allowNull: false },
      kind: { type: DataTypes.STRING, allowNull: false },
      objectKey: { type: DataTypes.STRING, unique: true },
      fileName: { type: DataTypes.STRING },
      contentType: { type: DataTypes.STRING },
      sizeBytes: {
        type: DataTypes.BIGINT,
        get() {
          const v = this.getDataValue('sizeBytes');
          return v === null || v === undefined ? null : Number(v);
        },
      },
      sha256: { type: DataTypes.STRING(64) },
      inspectionId: { type: DataTypes.UUID },
      note: { type: DataTypes.TEXT },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'protest_evidence', modelName: 'protestEvidence', underscored: true, updatedAt: false },
  );
}

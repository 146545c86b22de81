import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

// A calibration certificate of one instrument. Append-only: a correction is a newer certificate.
export class CalibrationCertificate extends Model<
  InferAttributes<CalibrationCertificate>,
  InferCreationAttributes<CalibrationCertificate>
> {
  declare id: CreationOptional<string>;
  declare instrumentId: string;
  declare number: string;
  declare laboratory: string;
  /** Calendar dates ("2026-11-02"), as printed on the certificate. */
  declare calibratedOn: string;
  declare dueOn: string;
  /** The stated expanded uncertainty U (mm or kg) and its coverage factor k. */
  declare expandedUncertainty: CreationOptional<number | null>;
  declare coverageFactor: CreationOptional<number>;
  declare objectKey: CreationOptional<string | null>;
  declare contentType: CreationOptional<string | null>;
  declare sizeBytes: CreationOptional<number | null>;
  declare sha256: CreationOptional<string | null>;
  declare addedById: string;
  declare createdAt: CreationOptional<Date>;
}

// A daily check of one instrument against a reference on one meeting day. Append-only.
export class InstrumentCheck extends Model<InferAttributes<InstrumentCheck>, InferCreationAttributes<InstrumentCheck>> {
  declare id: CreationOptional<string>;
  declare instrumentId: string;
  /** The calendar day of the check in the meeting's time zone. */
  declare meetingDay: string;
  declare reference: string;
  declare nominalValue: number;
  declare reading: number;
  declare passed: boolean;
  declare checkedById: string;
  declare checkedAt: CreationOptional<Date>;
}

export function initInstrumentCalibration(sequelize: Sequelize) {
  CalibrationCertificate.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      instrumentId: { type: DataTypes.UUID, allowNull: false },
      number: { type: DataTypes.STRING(80), allowNull: false },
      laboratory: { type: DataTypes.STRING(160), allowNull: false },
      calibratedOn: { type: DataTypes.DATEONLY, allowNull: false },
      dueOn: { type: DataTypes.DATEONLY, allowNull: false },
      expandedUncertainty: { type: DataTypes.DOUBLE },
      coverageFactor: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 2 },
      objectKey: { type: DataTypes.STRING, unique: true },
      contentType: { type: DataTypes.STRING },
      sizeBytes: {
        type: DataTypes.BIGINT,
        get() {
          const v = this.getDataValue('sizeBytes');
          return v == null ? null : Number(v);
        },
      },
      sha256: { type: DataTypes.STRING(64) },
      addedById: { type: DataTypes.UUID, allowNull: false },
      createdAt: DataTypes.DATE,
    },
    {
      sequelize,
      tableName: 'calibration_certificates',
      modelName: 'calibrationCertificate',
      underscored: true,
      updatedAt: false,
    },
  );
  InstrumentCheck.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      instrumentId: { type: DataTypes.UUID, allowNull: false },
      meetingDay: { type: DataTypes.DATEONLY, allowNull: false },
      reference: { type: DataTypes.TEXT, allowNull: false },
      nominalValue: { type: DataTypes.DOUBLE, allowNull: false },
      reading: { type: DataTypes.DOUBLE, allowNull: false },
      passed: { type: DataTypes.BOOLEAN, allowNull: false },
      checkedById: { type: DataTypes.UUID, allowNull: false },
      checkedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    },
    { sequelize, tableName: 'instrument_checks', modelName: 'instrumentCheck', underscored: true, timestamps: false },
  );
}

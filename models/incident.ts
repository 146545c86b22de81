import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

// An incident at a meeting (time, boat, what happened) recorded by the organiser or the chief scrutineer.
// Append-only: a correction is a new row that supersedes. Damage opens a re-inspection task, linked by
// reinspectionId. Photos live in object storage, their rows append-only. Migration 20261203012000.
export class Incident extends Model<InferAttributes<Incident>, InferCreationAttributes<Incident>> {
  declare id: CreationOptional<string>;
  declare eventId: string;
  declare entryId: string;
  declare occurredAt: Date;
  declare description: string;
  declare damage: boolean;
  declare reinspectionId: string | null;
  declare supersedesId: string | null;
  declare correctionReason: string | null;
  declare recordedById: string;
  declare createdAt: CreationOptional<Date>;
}

export class IncidentPhoto extends Model<InferAttributes<IncidentPhoto>, InferCreationAttributes<IncidentPhoto>> {
  declare id: CreationOptional<string>;
  declare incidentId: string;
  declare objectKey: string;
  declare contentType: string;
  declare sizeBytes: number;
  declare sha256: string;
  declare uploadedById: string;
  declare createdAt: CreationOptional<Date>;
}

export function initIncidents(sequelize: Sequelize) {
  Incident.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      eventId: { type: DataTypes.UUID, allowNull: false },
      entryId: { type: DataTypes.UUID, allowNull: false },
      occurredAt: { type: DataTypes.DATE, allowNull: false },
      description: { type: DataTypes.TEXT, allowNull: false },
      damage: { type: DataTypes.BOOLEAN, allowNull: false },
      reinspectionId: { type: DataTypes.UUID, allowNull: true },
      supersedesId: { type: DataTypes.UUID, allowNull: true },
      correctionReason: { type: DataTypes.TEXT, allowNull: true },
      recordedById: { type: DataTypes.UUID, allowNull: false },
      createdAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    },
    { sequelize, tableName: 'incidents', modelName: 'incident', underscored: true, timestamps: false },
  );
  IncidentPhoto.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      incidentId: { type: DataTypes.UUID, allowNull: false },
      objectKey: { type: DataTypes.STRING, allowNull: false },
      contentType: { type: DataTypes.STRING, allowNull: false },
      sizeBytes: { type: DataTypes.BIGINT, allowNull: false },
      sha256: { type: DataTypes.STRING(64), allowNull: false },
      uploadedById: { type: DataTypes.UUID, allowNull: false },
      createdAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    },
    { sequelize, tableName: 'incident_photos', modelName: 'incidentPhoto', underscored: true, timestamps: false },
  );
}

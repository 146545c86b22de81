import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

export type AuditSubjectType =
  | 'protest'
  | 'inspection'
  | 'rules'
  | 'results'
  | 'entry'
  | 'staff'
  | 'penalty'
  | 'appeal'
  | 'technical_report'
  | 'penalty_catalogue';

// One line of a meeting's audit trail. Append-only: the database refuses updates and deletes.
export class AuditEvent extends Model<InferAttributes<AuditEvent>, InferCreationAttributes<AuditEvent>> {
  declare id: CreationOptional<string>; // bigserial, read as a string so it never loses precision
  declare at: CreationOptional<Date>;
  declare eventId: string;
  declare actorId: string | null;
  declare subjectType: AuditSubjectType;
  declare subjectId: string;
  declare action: string;
  declare details: CreationOptional<Record<string, unknown>>;
}

export function initAuditEvents(sequelize: Sequelize) {
  AuditEvent.init(
    {
      id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
      at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      eventId: { type: DataTypes.UUID, allowNull: false },
      actorId: { type: DataTypes.UUID },
      subjectType: { type: DataTypes.STRING, allowNull: false },
      subjectId: { type: DataTypes.UUID, allowNull: false },
      action: { type: DataTypes.STRING, allowNull: false },
      details: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    },
    { sequelize, tableName: 'audit_events', modelName: 'auditEvent', underscored: true, timestamps: false },
  );
}

import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

// One message waiting in (or sent from) the mail outbox (migration 20261203007000). Written in the
// caller's transaction by lib/server/mail/outbox.ts, sent by lib/server/mail/outbox-worker.ts.
export class MailOutbox extends Model<InferAttributes<MailOutbox>, InferCreationAttributes<MailOutbox>> {
  declare id: CreationOptional<string>;
  declare kind: string;
  declare toAddress: string;
  declare subject: string;
  declare textBody: string;
  declare htmlBody: string | null;
  declare attempts: CreationOptional<number>;
  declare nextAttemptAt: CreationOptional<Date>;
  declare lastError: string | null;
  declare sentAt: Date | null;
  declare failedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
}

export function initMailOutbox(sequelize: Sequelize) {
  MailOutbox.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      kind: { type: DataTypes.STRING(40), allowNull: false },
      toAddress: { type: DataTypes.STRING(320), allowNull: false },
      subject: { type: DataTypes.TEXT, allowNull: false },
      textBody: { type: DataTypes.TEXT, allowNull: false },
      htmlBody: { type: DataTypes.TEXT },
      attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      nextAttemptAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      lastError: { type: DataTypes.TEXT },
      sentAt: { type: DataTypes.DATE },
      failedAt: { type: DataTypes.DATE },
      createdAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    },
    { sequelize, tableName: 'mail_outbox', modelName: 'mailOutbox', underscored: true, timestamps: false },
  );
}

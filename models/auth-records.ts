import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

// The tables next-auth's Sequelize adapter reads and writes (columns as the adapter defines them).
export class Account extends Model<InferAttributes<Account>, InferCreationAttributes<Account>> {
  declare id: CreationOptional<string>;
  declare type: string;
  declare provider: string;
  declare providerAccountId: string;
  declare refresh_token: string | null;
  declare access_token: string | null;
  declare expires_at: number | null;
  declare token_type: string | null;
  declare scope: string | null;
  declare id_token: string | null;
  declare session_state: string | null;
  declare userId: string;
}

export class Session extends Model<InferAttributes<Session>, InferCreationAttributes<Session>> {
  declare id: CreationOptional<string>;
  declare expires: Date;
  declare sessionToken: string;
  declare userId: string;
}

export class VerificationToken extends Model<
  InferAttributes<VerificationToken>,
  InferCreationAttributes<VerificationToken>
> {
  declare token: string;
  declare identifier: string;
  declare expires: Date;
}

export function initAuthRecords(sequelize: Sequelize) {
  const options = { sequelize, underscored: true, timestamps: false };
  Account.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      type: { type: DataTypes.STRING, allowNull: false },
      provider: { type: DataTypes.STRING, allowNull: false },
      providerAccountId: { type: DataTypes.STRING, allowNull: false },
      refresh_token: DataTypes.STRING,
      access_token: DataTypes.STRING,
      expires_at: DataTypes.INTEGER,
      token_type: DataTypes.STRING,
      scope: DataTypes.STRING,
      id_token: DataTypes.TEXT,
      session_state: DataTypes.STRING,
      userId: { type: DataTypes.UUID, allowNull: false },
    },
    { ...options, tableName: 'accounts', modelName: 'account' },
  );
  Session.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      expires: { type: DataTypes.DATE, allowNull: false },
      sessionToken: { type: DataTypes.STRING, allowNull: false, unique: true },
      userId: { type: DataTypes.UUID, allowNull: false },
    },
    { ...options, tableName: 'sessions', modelName: 'session' },
  );
  VerificationToken.init(
    {
      token: { type: DataTypes.STRING, primaryKey: true },
      identifier: { type: DataTypes.STRING, allowNull: false },
      expires: { type: DataTypes.DATE, allowNull: false },
    },
    { ...options, tableName: 'verification_tokens', modelName: 'verificationToken' },
  );
}

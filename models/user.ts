import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

// A person who can sign in. Staff roles are per event (see EventStaff); isAdmin is site-wide.
export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<string>;
  declare name: string | null;
  declare email: string;
  declare emailVerified: Date | null;
  declare image: CreationOptional<string | null>;
  declare passwordHash: CreationOptional<string | null>;
  declare isAdmin: CreationOptional<boolean>;
  declare suspendedAt: CreationOptional<Date | null>;
  declare suspendedReason: CreationOptional<string | null>;
  declare suspendedById: CreationOptional<string | null>;
  declare sessionVersion: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    User.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        name: { type: DataTypes.STRING },
        email: { type: DataTypes.STRING, allowNull: false, unique: true },
        emailVerified: { type: DataTypes.DATE },
        image: { type: DataTypes.STRING },
        passwordHash: { type: DataTypes.STRING },
        isAdmin: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        suspendedAt: { type: DataTypes.DATE },
        suspendedReason: { type: DataTypes.TEXT },
        suspendedById: { type: DataTypes.UUID },
        sessionVersion: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'users', modelName: 'user', underscored: true },
    );
  }
}

import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { StoredClassRules } from './shapes/class-rules';

// A class at one event. Its rules live in numbered versions (ClassRuleVersion).
export class RaceClass extends Model<InferAttributes<RaceClass>, InferCreationAttributes<RaceClass>> {
  declare id: CreationOptional<string>;
  declare eventId: string;
  declare name: string;
  declare code: string;
  declare description: CreationOptional<string>;
  declare copiedFromId: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

// One version of a class's rules. A published version is frozen (a database trigger refuses changes).
export class ClassRuleVersion extends Model<
  InferAttributes<ClassRuleVersion>,
  InferCreationAttributes<ClassRuleVersion>
> {
  declare id: CreationOptional<string>;
  declare classId: string;
  declare version: number;
  declare status: CreationOptional<'draft' | 'published'>;
  declare rules: StoredClassRules;
  declare changeNote: CreationOptional<string>;
  declare effectiveFrom: CreationOptional<Date | null>;
  declare publishedAt: CreationOptional<Date | null>;
  declare publishedById: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initRaceClasses(sequelize: Sequelize) {
  RaceClass.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      eventId: { type: DataTypes.UUID, allowNull: false },
      name: { type: DataTypes.STRING, allowNull: false },
      code: { type: DataTypes.STRING(12), allowNull: false },
      description: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      copiedFromId: { type: DataTypes.UUID },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'race_classes', modelName: 'raceClass', underscored: true },
  );
  ClassRuleVersion.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      classId: { type: DataTypes.UUID, allowNull: false },
      version: { type: DataTypes.INTEGER, allowNull: false },
      status: { type: DataTypes.STRING, allowNull: false, defaultValue: 'draft' },
      rules: { type: DataTypes.JSONB, allowNull: false },
      changeNote: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      effectiveFrom: { type: DataTypes.DATE },
      publishedAt: { type: DataTypes.DATE },
      publishedById: { type: DataTypes.UUID },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'class_rule_versions', modelName: 'classRuleVersion', underscored: true },
  );
}

import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

// What follows a boat from meeting to meeting: its components, the seals on them and officials'
// notes. Tables and triggers: migrations/20261203005000-create-components-seals-logbook.js.

export const COMPONENT_KINDS = ['engine', 'pump', 'impeller'] as const;
export type ComponentKind = (typeof COMPONENT_KINDS)[number];
export const COMPONENT_EVENT_ACTIONS = ['registered', 'fitted', 'removed', 'edited'] as const;
export type ComponentEventAction = (typeof COMPONENT_EVENT_ACTIONS)[number];
export const SEAL_ACTIONS = ['applied', 'intact', 'broken', 'missing', 'removed'] as const;
export type SealAction = (typeof SEAL_ACTIONS)[number];
export const LOG_NOTE_CATEGORIES = ['damage', 'repair', 'observation'] as const;
export type LogNoteCategory = (typeof LOG_NOTE_CATEGORIES)[number];

/** An engine, pump or impeller with its own identity; boatId is where it is now (null: on no boat). */
export class BoatComponent extends Model<InferAttributes<BoatComponent>, InferCreationAttributes<BoatComponent>> {
  declare id: CreationOptional<string>;
  declare kind: ComponentKind;
  declare maker: CreationOptional<string>;
  declare model: CreationOptional<string>;
  declare serialNumber: string;
  declare trimCode: CreationOptional<string>;
  declare notes: CreationOptional<string>;
  declare boatId: CreationOptional<string | null>;
  declare createdById: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

/** One step in a component's history (append-only). */
export class ComponentEvent extends Model<InferAttributes<ComponentEvent>, InferCreationAttributes<ComponentEvent>> {
  declare id: CreationOptional<string>;
  declare componentId: string;
  declare action: ComponentEventAction;
  declare boatId: CreationOptional<string | null>;
  declare details: CreationOptional<Record<string, unknown>>;
  declare recordedById: string;
  declare createdAt: CreationOptional<Date>;
}

/**
 * A component a declaration version names (append-only, like the version), with its identity as it
 * was then (migrations/20261203005100-snapshot-declared-components.js).
 */
export class DeclarationVersionComponent extends Model<
  InferAttributes<DeclarationVersionComponent>,
  InferCreationAttributes<DeclarationVersionComponent>
> {
  declare declarationVersionId: string;
  declare componentId: string;
  declare kind: ComponentKind;
  declare maker: string;
  declare model: string;
  declare serialNumber: string;
  declare trimCode: string;
}

/** Numbered seals issued to a meeting's scrutineers: prefix + first..last (append-only). */
export class SealBatch extends Model<InferAttributes<SealBatch>, InferCreationAttributes<SealBatch>> {
  declare id: CreationOptional<string>;
  declare eventId: string;
  declare prefix: CreationOptional<string>;
  declare firstNumber: number;
  declare lastNumber: number;
  declare note: CreationOptional<string>;
  declare issuedById: string;
  declare createdAt: CreationOptional<Date>;
}

/** One numbered seal (append-only); batchId null: carried over from a record written before the register. */
export class Seal extends Model<InferAttributes<Seal>, InferCreationAttributes<Seal>> {
  declare id: CreationOptional<string>;
  declare batchId: CreationOptional<string | null>;
  /** The organisation whose register holds it (set by a trigger from the batch's meeting). */
  declare organisationId: CreationOptional<string | null>;
  declare number: string;
  declare createdAt: CreationOptional<Date>;
}

/** One thing that happened to a seal (append-only): its whole history is the list of these. */
export class SealEvent extends Model<InferAttributes<SealEvent>, InferCreationAttributes<SealEvent>> {
  declare id: CreationOptional<string>;
  declare sealId: string;
  declare action: SealAction;
  declare componentId: CreationOptional<string | null>;
  declare boatId: CreationOptional<string | null>;
  declare eventId: CreationOptional<string | null>;
  declare inspectionId: CreationOptional<string | null>;
  declare position: CreationOptional<string>;
  declare photoId: CreationOptional<string | null>;
  declare reason: CreationOptional<string>;
  declare recordedById: string;
  declare createdAt: CreationOptional<Date>;
}

/** An official's dated note on a boat (append-only). */
export class BoatLogNote extends Model<InferAttributes<BoatLogNote>, InferCreationAttributes<BoatLogNote>> {
  declare id: CreationOptional<string>;
  declare boatId: string;
  declare eventId: string;
  declare category: LogNoteCategory;
  declare body: string;
  declare notedOn: string;
  declare authorId: string;
  declare createdAt: CreationOptional<Date>;
}

const id = { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true };
const append = { underscored: true, timestamps: false } as const;

export function initBoatRecord(sequelize: Sequelize) {
  BoatComponent.init(
    {
      id,
      kind: { type: DataTypes.STRING, allowNull: false },
      maker: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      model: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      serialNumber: { type: DataTypes.TEXT, allowNull: false },
      trimCode: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      boatId: { type: DataTypes.UUID },
      createdById: { type: DataTypes.UUID, allowNull: false },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'boat_components', modelName: 'boatComponent', underscored: true },
  );
  ComponentEvent.init(
    {
      id,
      componentId: { type: DataTypes.UUID, allowNull: false },
      action: { type: DataTypes.STRING, allowNull: false },
      boatId: { type: DataTypes.UUID },
      details: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
      recordedById: { type: DataTypes.UUID, allowNull: false },
      createdAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    },
    { sequelize, tableName: 'component_events', modelName: 'componentEvent', ...append },
  );
  DeclarationVersionComponent.init(
    {
      declarationVersionId: { type: DataTypes.UUID, allowNull: false, primaryKey: true },
      componentId: { type: DataTypes.UUID, allowNull: false, primaryKey: true },
      kind: { type: DataTypes.STRING, allowNull: false },
      maker: { type: DataTypes.TEXT, allowNull: false },
      model: { type: DataTypes.TEXT, allowNull: false },
      serialNumber: { type: DataTypes.TEXT, allowNull: false },
      trimCode: { type: DataTypes.TEXT, allowNull: false },
    },
    { sequelize, tableName: 'declaration_version_components', modelName: 'declarationVersionComponent', ...append },
  );
  SealBatch.init(
    {
      id,
      eventId: { type: DataTypes.UUID, allowNull: false },
      prefix: { type: DataTypes.STRING, allowNull: false, defaultValue: '' },
      firstNumber: { type: DataTypes.INTEGER, allowNull: false },
      lastNumber: { type: DataTypes.INTEGER, allowNull: false },
      note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      issuedById: { type: DataTypes.UUID, allowNull: false },
      createdAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    },
    { sequelize, tableName: 'seal_batches', modelName: 'sealBatch', ...append },
  );
  Seal.init(
    {
      id,
      batchId: { type: DataTypes.UUID },
      organisationId: { type: DataTypes.UUID },
      number: { type: DataTypes.STRING, allowNull: false },
      createdAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    },
    { sequelize, tableName: 'seals', modelName: 'seal', ...append },
  );
  SealEvent.init(
    {
      id,
      sealId: { type: DataTypes.UUID, allowNull: false },
      action: { type: DataTypes.STRING, allowNull: false },
      componentId: { type: DataTypes.UUID },
      boatId: { type: DataTypes.UUID },
      eventId: { type: DataTypes.UUID },
      inspectionId: { type: DataTypes.UUID },
      position: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      photoId: { type: DataTypes.UUID },
      reason: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      recordedById: { type: DataTypes.UUID, allowNull: false },
      createdAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    },
    { sequelize, tableName: 'seal_events', modelName: 'sealEvent', ...append },
  );
  BoatLogNote.init(
    {
      id,
      boatId: { type: DataTypes.UUID, allowNull: false },
      eventId: { type: DataTypes.UUID, allowNull: false },
      category: { type: DataTypes.STRING, allowNull: false },
      body: { type: DataTypes.TEXT, allowNull: false },
      notedOn: { type: DataTypes.DATEONLY, allowNull: false },
      authorId: { type: DataTypes.UUID, allowNull: false },
      createdAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    },
    { sequelize, tableName: 'boat_log_notes', modelName: 'boatLogNote', ...append },
  );
}

/**
 * The initial schema. Portable DDL only (SQLite and PostgreSQL): strings instead of ENUM
 * types (the closed lists are checked by the models), JSON columns, explicit indexes on every
 * foreign key. This file is the schema of record; the models must match it
 * (tests/migrations checks that every model attribute has its column).
 */
import {
  DataTypes,
  type ModelAttributeColumnOptions,
  type QueryInterface,
  type Transaction,
} from 'sequelize';

type Columns = Record<string, ModelAttributeColumnOptions>;

const id: ModelAttributeColumnOptions = {
  type: DataTypes.INTEGER,
  autoIncrement: true,
  primaryKey: true,
  allowNull: false,
};
const timestamps: Columns = {
  createdAt: { type: DataTypes.DATE, allowNull: false },
  updatedAt: { type: DataTypes.DATE, allowNull: false },
};
const version: ModelAttributeColumnOptions = {
  type: DataTypes.INTEGER,
  allowNull: false,
  defaultValue: 0,
};

function ref(
  table: string,
  onDelete: 'CASCADE' | 'SET NULL' | 'RESTRICT',
  allowNull = onDelete === 'SET NULL',
): ModelAttributeColumnOptions {
  return {
    type: DataTypes.INTEGER,
    allowNull,
    references: { model: table, key: 'id' },
    onDelete,
    onUpdate: 'CASCADE',
  };
}

const str = (
  length: number,
  allowNull = true,
  extra: Partial<ModelAttributeColumnOptions> = {},
): ModelAttributeColumnOptions => ({
  type: DataTypes.STRING(length),
  allowNull,
  ...extra,
});
const text = (allowNull = true): ModelAttributeColumnOptions => ({
  type: DataTypes.TEXT,
  allowNull,
});
const json = (allowNull = true): ModelAttributeColumnOptions => ({
  type: DataTypes.JSON,
  allowNull,
});
const double = (allowNull = true, defaultValue?: number): ModelAttributeColumnOptions => ({
  type: DataTypes.DOUBLE,
  allowNull,
  ...(defaultValue === undefined ? {} : { defaultValue }),
});
const int = (allowNull = true, defaultValue?: number): ModelAttributeColumnOptions => ({
  type: DataTypes.INTEGER,
  allowNull,
  ...(defaultValue === undefined ? {} : { defaultValue }),
});
const bool = (defaultValue: boolean): ModelAttributeColumnOptions => ({
  type: DataTypes.BOOLEAN,
  allowNull: false,
  defaultValue,
});
const date = (allowNull = true): ModelAttributeColumnOptions => ({
  type: DataTypes.DATE,
  allowNull,
});

/** Tables in creation order; `down` drops them in reverse. */
const TABLES: Array<{
  name: string;
  columns: Columns;
  indexes: Array<{ fields: string[]; unique?: boolean }>;
}> = [
  {
    name: 'users',
    columns: {
      id,
      email: str(254, false, { unique: true }),
      name: str(120, false),
      passwordHash: str(100, false),
      isAdmin: bool(false),
      active: bool(true),
      version,
      ...timestamps,
    },
    indexes: [],
  },
  {
    name: 'projects',
    columns: {
      id,
      name: str(200, false),
      code: str(40, false, { unique: true }),
      client: str(200),
      site: str(200),
      mainsSystem: str(40, false, { defaultValue: '230/400V 50Hz' }),
      nominalVoltage: double(false, 230),
      frequency: double(false, 50),
      supplyTolerance: double(false, 0.1),
      dcSupplyMax: double(false, 28.8),
      ambientC: double(false, 40),
      overvoltageCategory: str(3, false, { defaultValue: 'II' }),
      surgeLevelKv: double(false, 1),
      surgeCoupling: str(20, false, { defaultValue: 'line-earth' }),
      esdLevelKv: double(false, 4),
      powerDerating: double(false, 0.5),
      voltageDerating: double(false, 0.8),
      wireColourConvention: str(20, false, { defaultValue: 'iec60204-1' }),
      faultMode: str(20, false, { defaultValue: 'line-earth' }),
      likelihoodWeights: json(),
      version,
      ...timestamps,
    },
    indexes: [],
  },
  {
    name: 'project_members',
    columns: {
      id,
      userId: ref('users', 'CASCADE'),
      projectId: ref('projects', 'CASCADE'),
      role: str(20, false),
      ...timestamps,
    },
    indexes: [{ fields: ['userId', 'projectId'], unique: true }, { fields: ['projectId'] }],
  },
  {
    name: 'invitations',
    columns: {
      id,
      email: str(254, false),
      projectId: ref('projects', 'CASCADE'),
      role: str(20, false),
      token: str(128, false, { unique: true }),
      expiresAt: date(false),
      acceptedAt: date(),
      invitedById: ref('users', 'SET NULL'),
      ...timestamps,
    },
    indexes: [{ fields: ['projectId'] }, { fields: ['invitedById'] }, { fields: ['email'] }],
  },
  {
    name: 'cabinets',
    columns: {
      id,
      projectId: ref('projects', 'CASCADE'),
      tag: str(40, false),
      name: str(200, false),
      location: str(200),
      version,
      ...timestamps,
    },
    indexes: [{ fields: ['projectId', 'tag'], unique: true }],
  },
  {
    name: 'strips',
    columns: {
      id,
      cabinetId: ref('cabinets', 'CASCADE'),
      tag: str(20, false),
      name: str(200),
      order: int(false, 0),
      version,
      ...timestamps,
    },
    indexes: [{ fields: ['cabinetId', 'tag'], unique: true }],
  },
  {
    name: 'terminals',
    columns: {
      id,
      stripId: ref('strips', 'CASCADE'),
      position: int(false),
      level: int(false, 1),
      blockId: str(40),
      label: str(40, false),
      terminalNumber: str(20),
      wireNumber: str(40),
      cableId: str(40),
      cableCore: str(20),
      connector: str(40),
      wireColour: str(30),
      circuitClass: str(20, false),
      hazardKind: str(20),
      nominalVoltage: double(),
      currentKind: str(2),
      frequency: double(),
      sourceImpedance: double(),
      bridgeGroup: str(40),
      // channelId is added after `channels` exists (the two tables refer to each other).
      notes: text(),
      version,
      ...timestamps,
    },
    indexes: [
      { fields: ['stripId', 'position', 'level'], unique: true },
      { fields: ['cableId'] },
      { fields: ['label'] },
    ],
  },
  {
    name: 'guard_recipes',
    columns: {
      id,
      projectId: ref('projects', 'CASCADE'),
      name: str(120, false),
      description: text(),
      guard: json(false),
      isPreset: bool(false),
      version,
      ...timestamps,
    },
    indexes: [{ fields: ['projectId', 'name'], unique: true }],
  },
  {
    name: 'channels',
    columns: {
      id,
      projectId: ref('projects', 'CASCADE'),
      cabinetId: ref('cabinets', 'CASCADE'),
      tag: str(40, false),
      name: str(200),
      signalType: str(20, false),
      signalTerminalId: ref('terminals', 'SET NULL'),
      returnTerminalId: ref('terminals', 'SET NULL'),
      // RESTRICT: deleting a recipe in use must not silently leave channels unprotected.
      guardRecipeId: ref('guard_recipes', 'RESTRICT', true),
      guardOverrides: json(),
      notes: text(),
      version,
      ...timestamps,
    },
    indexes: [
      { fields: ['projectId', 'tag'], unique: true },
      { fields: ['cabinetId'] },
      { fields: ['signalTerminalId'] },
      { fields: ['returnTerminalId'] },
      { fields: ['guardRecipeId'] },
    ],
  },
  {
    name: 'audit_runs',
    columns: {
      id,
      projectId: ref('projects', 'CASCADE'),
      createdById: ref('users', 'SET NULL'),
      status: str(20, false, { defaultValue: 'queued' }),
      progress: double(false, 0),
      inputHash: str(128),
      snapshot: json(),
      summary: json(),
      error: text(),
      startedAt: date(),
      finishedAt: date(),
      reviewState: str(20, false, { defaultValue: 'draft' }),
      signedById: ref('users', 'SET NULL'),
      signedAt: date(),
      ...timestamps,
    },
    indexes: [
      { fields: ['projectId'] },
      { fields: ['createdById'] },
      { fields: ['signedById'] },
      { fields: ['inputHash'] },
    ],
  },
  {
    name: 'findings',
    columns: {
      id,
      auditRunId: ref('audit_runs', 'CASCADE'),
      channelId: ref('channels', 'SET NULL'),
      kind: str(20, false),
      stressCase: str(60),
      mechanism: str(20),
      hazardTerminalId: ref('terminals', 'SET NULL'),
      verdict: str(20, false),
      reason: text(false),
      margin: double(),
      figures: json(),
      key: str(255, false),
      ...timestamps,
    },
    indexes: [
      { fields: ['auditRunId', 'key'], unique: true },
      { fields: ['channelId'] },
      { fields: ['hazardTerminalId'] },
    ],
  },
  {
    name: 'decisions',
    columns: {
      id,
      findingId: ref('findings', 'CASCADE'),
      reviewerId: ref('users', 'RESTRICT', false),
      outcome: str(20, false),
      justification: text(),
      version,
      ...timestamps,
    },
    indexes: [{ fields: ['findingId'], unique: true }, { fields: ['reviewerId'] }],
  },
  {
    name: 'markups',
    columns: {
      id,
      projectId: ref('projects', 'CASCADE'),
      terminalId: ref('terminals', 'SET NULL'),
      authorId: ref('users', 'RESTRICT', false),
      kind: str(20, false),
      before: json(),
      after: json(),
      note: text(),
      status: str(20, false, { defaultValue: 'proposed' }),
      decidedById: ref('users', 'SET NULL'),
      decidedAt: date(),
      clientId: str(64, true, { unique: true }),
      version,
      ...timestamps,
    },
    indexes: [
      { fields: ['projectId', 'status'] },
      { fields: ['terminalId'] },
      { fields: ['authorId'] },
      { fields: ['decidedById'] },
    ],
  },
  {
    name: 'attachments',
    columns: {
      id,
      projectId: ref('projects', 'CASCADE'),
      markupId: ref('markups', 'SET NULL'),
      uploadedById: ref('users', 'SET NULL'),
      kind: str(20, false),
      originalName: str(255, false),
      storedName: str(255, false, { unique: true }),
      mimeType: str(100, false),
      size: int(false),
      storage: str(10, false, { defaultValue: 'disk' }),
      ...timestamps,
    },
    indexes: [{ fields: ['projectId'] }, { fields: ['markupId'] }, { fields: ['uploadedById'] }],
  },
  {
    // No foreign keys on purpose: the log outlives what it mentions.
    name: 'audit_logs',
    columns: {
      id,
      actorId: int(),
      projectId: int(),
      action: str(60, false),
      entity: str(40, false),
      entityId: int(),
      detail: json(),
      createdAt: date(false),
    },
    indexes: [
      { fields: ['projectId', 'createdAt'] },
      { fields: ['actorId'] },
      { fields: ['entity', 'entityId'] },
    ],
  },
  {
    name: 'outbox_messages',
    columns: {
      id,
      to: str(254, false),
      subject: str(300, false),
      text: text(false),
      html: text(),
      sentAt: date(),
      messageId: str(300),
      error: text(),
      ...timestamps,
    },
    indexes: [{ fields: ['createdAt'] }],
  },
];

export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.transaction(async (transaction: Transaction) => {
    for (const table of TABLES) {
      await qi.createTable(table.name, table.columns, { transaction });
      for (const index of table.indexes) {
        await qi.addIndex(table.name, index.fields, { unique: index.unique ?? false, transaction });
      }
    }
    await qi.addColumn('terminals', 'channelId', ref('channels', 'SET NULL'), { transaction });
    await qi.addIndex('terminals', ['channelId'], { transaction });
  });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.transaction(async (transaction: Transaction) => {
    for (const table of [...TABLES].reverse()) {
      await qi.dropTable(table.name, { cascade: true, transaction });
    }
  });
}

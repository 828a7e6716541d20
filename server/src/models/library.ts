import {
  type CreationOptional,
  DataTypes,
  type InferAttributes,
  type InferCreationAttributes,
  Model,
  type ModelStatic,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import type { LibraryData, LibraryKind, RevisionState, UploadPreviewData, UploadPurpose, UploadIssue } from 'wick-core';

/** A library entry (fibre, web or liquid); its content lives in its revisions. Schema: migrations/0003-library.ts. */
export class LibraryEntry extends Model<InferAttributes<LibraryEntry>, InferCreationAttributes<LibraryEntry>> {
  declare id: CreationOptional<number>;
  declare kind: LibraryKind;
  /** Incremented on every change to the entry or its revisions (optimistic locking). */
  declare version: CreationOptional<number>;
  declare headRevisionId: number | null;
  declare approvedRevisionId: number | null;
  declare createdBy: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare head?: NonAttribute<LibraryRevision>;
}

export class LibraryRevision extends Model<InferAttributes<LibraryRevision>, InferCreationAttributes<LibraryRevision>> {
  declare id: CreationOptional<number>;
  declare entryId: number;
  declare number: number;
  declare state: CreationOptional<RevisionState>;
  declare name: string;
  declare supplierId: number | null;
  declare notes: CreationOptional<string>;
  declare data: LibraryData;
  declare createdBy: number;
  declare updatedBy: number;
  declare submittedBy: CreationOptional<number | null>;
  declare submittedAt: CreationOptional<Date | null>;
  declare reviewedBy: CreationOptional<number | null>;
  declare reviewedAt: CreationOptional<Date | null>;
  declare reviewComment: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

/** An uploaded file, kept byte for byte with its SHA-256 for traceability. */
export class LibraryFile extends Model<InferAttributes<LibraryFile>, InferCreationAttributes<LibraryFile>> {
  declare id: CreationOptional<number>;
  declare purpose: UploadPurpose;
  declare fileName: string;
  declare mediaType: string;
  declare size: number;
  declare sha256: string;
  declare encoding: string;
  declare delimiter: string;
  declare content: Buffer;
  declare uploadedBy: number;
  declare createdAt: CreationOptional<Date>;
}

/** A parsed upload waiting for the person to commit or discard it. */
export class LibraryUpload extends Model<InferAttributes<LibraryUpload>, InferCreationAttributes<LibraryUpload>> {
  declare id: CreationOptional<number>;
  declare purpose: UploadPurpose;
  declare entryId: number | null;
  declare fileId: number;
  declare status: CreationOptional<'pending' | 'committed' | 'discarded'>;
  declare preview: UploadPreviewData;
  declare warnings: CreationOptional<UploadIssue[]>;
  declare createdBy: number;
  declare expiresAt: Date;
  declare committedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
}

/** A message to send; written in the transaction of the decision it reports, sent after commit. */
export class MailOutbox extends Model<InferAttributes<MailOutbox>, InferCreationAttributes<MailOutbox>> {
  declare id: CreationOptional<number>;
  declare toAddress: string;
  declare subject: string;
  declare text: string;
  declare status: CreationOptional<'pending' | 'sent' | 'failed'>;
  declare attempts: CreationOptional<number>;
  declare lastError: CreationOptional<string | null>;
  declare nextAttemptAt: CreationOptional<Date>;
  declare sentAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
}

export interface LibraryModels {
  readonly Entry: ModelStatic<LibraryEntry>;
  readonly Revision: ModelStatic<LibraryRevision>;
  readonly File: ModelStatic<LibraryFile>;
  readonly Upload: ModelStatic<LibraryUpload>;
  readonly Outbox: ModelStatic<MailOutbox>;
}

const bound = new WeakMap<Sequelize, LibraryModels>();

/**
 * The library models bound to one Sequelize instance. Each instance gets its own subclasses, so an app built
 * on a second connection (tests do that) never rebinds the classes another app uses.
 */
export function libraryModels(sequelize: Sequelize): LibraryModels {
  const hit = bound.get(sequelize);
  if (hit) return hit;
  const Entry = class extends LibraryEntry {};
  const Revision = class extends LibraryRevision {};
  const File = class extends LibraryFile {};
  const Upload = class extends LibraryUpload {};
  const Outbox = class extends MailOutbox {};
  // Fresh objects each time: Sequelize writes the column name into an attribute's options.
  const user = () => ({ type: DataTypes.INTEGER, allowNull: false });
  const optionalUser = () => ({ type: DataTypes.INTEGER, allowNull: true });

  Entry.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      kind: { type: DataTypes.STRING(10), allowNull: false },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
      headRevisionId: { type: DataTypes.INTEGER, allowNull: true },
      approvedRevisionId: { type: DataTypes.INTEGER, allowNull: true },
      createdBy: user(),
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'LibraryEntry', tableName: 'library_entries', underscored: true },
  );
  Revision.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      entryId: { type: DataTypes.INTEGER, allowNull: false },
      number: { type: DataTypes.INTEGER, allowNull: false },
      state: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'draft' },
      name: { type: DataTypes.STRING(200), allowNull: false },
      supplierId: { type: DataTypes.INTEGER, allowNull: true },
      notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      data: { type: DataTypes.JSONB, allowNull: false },
      createdBy: user(),
      updatedBy: user(),
      submittedBy: optionalUser(),
      submittedAt: { type: DataTypes.DATE, allowNull: true },
      reviewedBy: optionalUser(),
      reviewedAt: { type: DataTypes.DATE, allowNull: true },
      reviewComment: { type: DataTypes.TEXT, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'LibraryRevision', tableName: 'library_revisions', underscored: true },
  );
  File.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      purpose: { type: DataTypes.STRING(20), allowNull: false },
      fileName: { type: DataTypes.STRING(255), allowNull: false },
      mediaType: { type: DataTypes.STRING(100), allowNull: false },
      size: { type: DataTypes.INTEGER, allowNull: false },
      sha256: { type: DataTypes.CHAR(64), allowNull: false },
      encoding: { type: DataTypes.STRING(20), allowNull: false },
      delimiter: { type: DataTypes.STRING(4), allowNull: false },
      content: { type: DataTypes.BLOB, allowNull: false },
      uploadedBy: user(),
      createdAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'LibraryFile', tableName: 'library_files', underscored: true, updatedAt: false },
  );
  Upload.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      purpose: { type: DataTypes.STRING(20), allowNull: false },
      entryId: { type: DataTypes.INTEGER, allowNull: true },
      fileId: { type: DataTypes.INTEGER, allowNull: false },
      status: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'pending' },
      preview: { type: DataTypes.JSONB, allowNull: false },
      warnings: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
      createdBy: user(),
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      committedAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'LibraryUpload', tableName: 'library_uploads', underscored: true, updatedAt: false },
  );
  Outbox.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      toAddress: { type: DataTypes.STRING(320), allowNull: false },
      subject: { type: DataTypes.STRING(300), allowNull: false },
      text: { type: DataTypes.TEXT, allowNull: false },
      status: { type: DataTypes.STRING(10), allowNull: false, defaultValue: 'pending' },
      attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      lastError: { type: DataTypes.TEXT, allowNull: true },
      nextAttemptAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      sentAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'MailOutbox', tableName: 'mail_outbox', underscored: true, updatedAt: false },
  );

  // Associations, all in one place.
  Entry.hasMany(Revision, { foreignKey: 'entryId', as: 'revisions' });
  Revision.belongsTo(Entry, { foreignKey: 'entryId', as: 'entry' });
  Entry.belongsTo(Revision, { foreignKey: 'headRevisionId', as: 'head', constraints: false });
  Upload.belongsTo(File, { foreignKey: 'fileId', as: 'file' });

  const models: LibraryModels = { Entry, Revision, File, Upload, Outbox };
  bound.set(sequelize, models);
  return models;
}

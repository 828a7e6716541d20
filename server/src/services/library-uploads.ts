/**
 * Uploads into the library: a pore-size distribution or a lab curve for a web, and a bulk import of webs.
 * Each upload is read, checked row by row and — only when every row is good — kept as a preview with its
 * original bytes and SHA-256. Committing applies it in one transaction (an edit with optimistic locking for a
 * web, or all imported webs at once); a bad file, a failed check or a failed commit changes nothing.
 */
import { Op, QueryTypes, type Transaction } from 'sequelize';
import {
  type CurveMeasurement,
  type FileRef,
  type LabCurve,
  type LibraryData,
  type PropertySource,
  type PsdForm,
  type UploadCommitResult,
  type UploadPreview,
  type UploadPreviewData,
  type UploadPurpose,
  type WebData,
} from 'wick-core';
import type { SessionUser } from '../auth/authorize';
import { AppError } from '../errors';
import type { LibraryUpload } from '../models/library';
import { parseCurveCsv } from '../uploads/curve-csv';
import { readCsvTable, reject, type CsvTable, type UploadedFile } from '../uploads/csv-table';
import { parsePsdCsv } from '../uploads/psd-csv';
import { parseWebImportCsv } from '../uploads/web-import-csv';
import { createEntryIn, type LibraryContext, patchEntryData } from './library';

/** Limits; the byte limit is also multer's (WICK_UPLOAD_MAX_BYTES). */
export const UPLOAD_LIMITS = {
  maxBytes: Number(process.env['WICK_UPLOAD_MAX_BYTES'] ?? 1024 * 1024),
  maxRows: { psd: 2000, curve: 20000, 'web-import': 500 } satisfies Record<UploadPurpose, number>,
  /** A preview not committed within this time is discarded. */
  previewTtlMs: 60 * 60 * 1000,
};

export type UploadRequest =
  | { readonly purpose: 'psd'; readonly entryId: number; readonly form?: PsdForm; readonly source: PropertySource }
  | { readonly purpose: 'curve'; readonly entryId: number; readonly name: string; readonly measurement?: CurveMeasurement; readonly liquid?: string }
  | { readonly purpose: 'web-import' };

async function editableWeb(ctx: LibraryContext, id: number, t?: Transaction): Promise<void> {
  const entry = await ctx.models.Entry.findOne({ where: { id, kind: 'web' }, transaction: t });
  if (!entry || entry.headRevisionId === null) throw new AppError(404, 'not-found', `There is no web with id ${id}.`);
  const head = await ctx.models.Revision.findByPk(entry.headRevisionId, { attributes: ['state', 'number'], transaction: t });
  if (head?.state === 'in-review') {
    throw new AppError(409, 'wrong-state', `Revision ${head.number} is in review: uploads wait until a reviewer approves or returns it.`, { state: head.state });
  }
}

async function importLookups(ctx: LibraryContext) {
  const suppliers = await ctx.sequelize.query<{ id: number; name: string }>('SELECT id, name FROM suppliers', { type: QueryTypes.SELECT });
  const fibres = await ctx.sequelize.query<{ id: number; name: string }>(
    `SELECT e.id, r.name FROM library_entries e JOIN library_revisions r ON r.id = e.head_revision_id WHERE e.kind = 'fibre'`,
    { type: QueryTypes.SELECT },
  );
  return {
    suppliers: new Map(suppliers.map((s) => [s.name.toLowerCase(), s.id])),
    fibres: new Map(fibres.map((f) => [f.name.toLowerCase(), f.id])),
  };
}

function slug(text: string): string {
  const s = text.toLowerCase().normalize('NFKD').replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 30);
  return s || 'curve';
}

function previewOf(u: LibraryUpload, info: UploadPreview['file']): UploadPreview {
  return { uploadId: u.id, entryId: u.entryId, file: info, warnings: u.warnings, preview: u.preview, expiresAt: u.expiresAt.toISOString() };
}

/** Keeps an uploaded CSV byte for byte, with what reading it found (encoding, delimiter), inside `t`. */
export async function storeFile(
  ctx: LibraryContext,
  purpose: UploadPurpose,
  file: UploadedFile,
  table: CsvTable,
  user: SessionUser,
  t: Transaction,
) {
  return ctx.models.File.create(
    {
      purpose,
      fileName: file.fileName.slice(0, 255),
      mediaType: file.mediaType.slice(0, 100) || 'text/csv',
      size: file.bytes.length,
      sha256: table.sha256,
      encoding: table.info.encoding,
      delimiter: table.info.delimiter,
      content: file.bytes,
      uploadedBy: user.id,
    },
    { transaction: t },
  );
}

/** Reads, checks and keeps an upload as a preview. Nothing is stored unless every row is good. */
export async function previewUpload(ctx: LibraryContext, request: UploadRequest, file: UploadedFile, user: SessionUser): Promise<UploadPreview> {
  if (request.purpose !== 'web-import') await editableWeb(ctx, request.entryId);
  const table = readCsvTable(file, UPLOAD_LIMITS.maxRows[request.purpose]);
  const fileRef = (id: number): FileRef => ({ fileId: id, fileName: file.fileName, sha256: table.sha256 });

  let build: (ref: FileRef) => UploadPreviewData;
  let warnings;
  if (request.purpose === 'psd') {
    const r = parsePsdCsv(table, { form: request.form, source: request.source });
    if (r.issues.length || !r.psd) throw reject(table.info, r.issues);
    const psd = r.psd;
    build = (ref) => ({ purpose: 'psd', psd: { ...psd, file: ref } });
    warnings = r.warnings;
  } else if (request.purpose === 'curve') {
    const r = parseCurveCsv(table, request.measurement);
    if (r.issues.length || !r.curve) throw reject(table.info, r.issues);
    const curve = r.curve;
    const key = `${slug(request.name)}-${table.sha256.slice(0, 8)}`;
    build = (ref) => ({
      purpose: 'curve',
      curve: { key, name: request.name, ...(request.liquid ? { liquid: request.liquid } : {}), ...curve, file: ref } satisfies LabCurve,
    });
    warnings = r.warnings;
  } else {
    const r = parseWebImportCsv(table, await importLookups(ctx));
    if (r.issues.length) throw reject(table.info, r.issues);
    const webs = r.webs;
    build = (ref) => ({
      purpose: 'web-import',
      webs: webs.map((w) => ({ line: w.line, input: { ...w.input, notes: w.input.notes || `Imported from ${ref.fileName}, line ${w.line}.` } })),
    });
    warnings = r.warnings;
  }

  const upload = await ctx.sequelize.transaction(async (t) => {
    await discardExpired(ctx, t);
    const f = await storeFile(ctx, request.purpose, file, table, user, t);
    return ctx.models.Upload.create(
      {
        purpose: request.purpose,
        entryId: request.purpose === 'web-import' ? null : request.entryId,
        fileId: f.id,
        preview: build(fileRef(f.id)),
        warnings,
        createdBy: user.id,
        expiresAt: new Date(Date.now() + UPLOAD_LIMITS.previewTtlMs),
      },
      { transaction: t },
    );
  });
  return previewOf(upload, table.info);
}

/** Pending previews past their time, with their files (a committed upload's file stays: revisions refer to it). */
async function discardExpired(ctx: LibraryContext, t: Transaction): Promise<void> {
  const old = await ctx.models.Upload.findAll({ where: { status: 'pending', expiresAt: { [Op.lt]: new Date() } }, transaction: t });
  for (const u of old) {
    await u.destroy({ transaction: t });
    await ctx.models.File.destroy({ where: { id: u.fileId }, transaction: t });
  }
}

async function ownPendingUpload(ctx: LibraryContext, id: number, user: SessionUser, t?: Transaction): Promise<LibraryUpload> {
  const u = await ctx.models.Upload.findByPk(id, { transaction: t, ...(t ? { lock: t.LOCK.UPDATE } : {}) });
  if (!u || u.createdBy !== user.id) throw new AppError(404, 'not-found', `There is no upload ${id} of yours.`);
  if (u.status !== 'pending') throw new AppError(409, 'upload-done', `Upload ${id} was already ${u.status}.`);
  if (u.expiresAt.getTime() < Date.now()) throw new AppError(410, 'upload-expired', `The preview of upload ${id} expired; upload the file again.`);
  return u;
}

export async function getUpload(ctx: LibraryContext, id: number, user: SessionUser): Promise<UploadPreview> {
  const u = await ownPendingUpload(ctx, id, user);
  const f = await ctx.models.File.findByPk(u.fileId, { attributes: ['fileName', 'size', 'sha256', 'encoding', 'delimiter'] });
  const rows = u.preview.purpose === 'psd' ? u.preview.psd.diameters.length : u.preview.purpose === 'curve' ? u.preview.curve.times.length : u.preview.webs.length;
  return previewOf(u, { fileName: f!.fileName, size: f!.size, sha256: f!.sha256, encoding: f!.encoding, delimiter: f!.delimiter, rows });
}

export async function discardUpload(ctx: LibraryContext, id: number, user: SessionUser): Promise<void> {
  await ctx.sequelize.transaction(async (t) => {
    const u = await ownPendingUpload(ctx, id, user, t);
    await u.destroy({ transaction: t });
    await ctx.models.File.destroy({ where: { id: u.fileId }, transaction: t });
  });
}

/** Applies a preview: all of it in one transaction, or nothing. */
export async function commitUpload(ctx: LibraryContext, id: number, version: number | undefined, user: SessionUser): Promise<UploadCommitResult> {
  return ctx.sequelize.transaction(async (t) => {
    const u = await ownPendingUpload(ctx, id, user, t);
    const preview = u.preview;
    let entryIds: number[];
    if (preview.purpose === 'web-import') {
      const f = await ctx.models.File.findByPk(u.fileId, { attributes: ['id', 'fileName', 'sha256'], transaction: t });
      entryIds = [];
      for (const w of preview.webs) {
        entryIds.push(await createEntryIn(ctx, 'web', w.input, user, t, { importedFrom: { fileId: f!.id, fileName: f!.fileName, sha256: f!.sha256, line: w.line } }));
      }
    } else {
      if (version === undefined) {
        throw new AppError(422, 'validation-failed', 'Invalid body: version — required to change a web.', {
          issues: [{ field: 'version', rule: 'invalid_type', message: 'Give the entry version the upload is meant for.' }],
        });
      }
      const patch = (data: LibraryData): LibraryData => {
        const web = data as WebData;
        if (preview.purpose === 'psd') return { ...web, poreSizeDistribution: preview.psd };
        const same = web.curves.findIndex((c) => c.name.toLowerCase() === preview.curve.name.toLowerCase());
        const curve = same >= 0 ? { ...preview.curve, key: web.curves[same].key } : preview.curve;
        const curves = same >= 0 ? web.curves.map((c, i) => (i === same ? curve : c)) : [...web.curves, curve];
        return { ...web, curves };
      };
      await patchEntryData(ctx, 'web', u.entryId!, version, user, patch, t);
      entryIds = [u.entryId!];
    }
    u.set({ status: 'committed', committedAt: new Date() });
    await u.save({ transaction: t });
    return { purpose: preview.purpose, entryIds };
  });
}

/** The original bytes of an uploaded file, for download. */
export async function fileContent(ctx: LibraryContext, id: number) {
  const f = await ctx.models.File.findByPk(id);
  if (!f) throw new AppError(404, 'not-found', `There is no file ${id}.`);
  return f;
}

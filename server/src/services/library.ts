/**
 * The library's use cases: list, read, create, update, submit, approve, return, delete a draft, history and diff.
 *
 * Rules enforced here (never only in the UI):
 * - one open revision per entry (draft, in review or returned); approved revisions are never changed — editing an
 *   approved entry starts revision n+1 as a draft; approving makes it the revision in force (the older approved
 *   one is then superseded);
 * - optimistic locking: every change names the entry version it was based on, a stale one gets 409 with the
 *   current entry;
 * - four-eyes: nobody approves or returns a revision they created, edited or submitted;
 * - every change writes an audit row and, for review decisions, queues e-mail in the same transaction.
 */
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import {
  type BlendComponent,
  blendFibres,
  DomainError,
  type EntryActions,
  type EntryDetail,
  type EntryFigure,
  type EntrySummary,
  type FibreData,
  type FileRef,
  interpolateTable,
  LIBRARY_COLLECTION,
  type LibraryData,
  type LibraryKind,
  type LiquidData,
  type LiquidPropertyData,
  type Page,
  type Revision,
  type RevisionDiff,
  type RevisionInput,
  type RevisionState,
  type RevisionSummary,
  rolesAllow,
  type SupplierRef,
  type UserRef,
  type WebData,
  webPorosity,
} from 'wick-core';
import type { SessionUser } from '../auth/authorize';
import { AppError } from '../errors';
import type { MailConfig } from '../mail/mail-config';
import type { MailOutboxDispatcher, OutboxMessage } from '../mail/outbox';
import { type LibraryEntry, type LibraryModels, type LibraryRevision, libraryModels } from '../models/library';
import type { z } from 'zod';
import type { allEntriesQuerySchema } from '../schemas/library';
import { audit } from './audit';
import { jsonDiff } from './library-diff';
import { person, refOf, reviewers, userRefs } from './library-people';

export interface LibraryContext {
  readonly sequelize: Sequelize;
  readonly models: LibraryModels;
  readonly outbox: MailOutboxDispatcher;
  readonly mail: MailConfig;
}

export function libraryContext(sequelize: Sequelize, outbox: MailOutboxDispatcher): LibraryContext {
  return { sequelize, models: libraryModels(sequelize), outbox, mail: outbox.config };
}

export type ListQueryInput = z.output<typeof allEntriesQuerySchema>;

const EDITABLE_STATES: readonly RevisionState[] = ['draft', 'returned', 'approved'];

const KIND_WORDS: Record<LibraryKind, string> = { fibre: 'fibre', web: 'web', liquid: 'liquid' };

/** Where the UI shows an entry (links in e-mail). */
export function entryPath(kind: LibraryKind, id: number): string {
  return kind === 'liquid' ? `/liquids/${id}` : `/materials/${LIBRARY_COLLECTION[kind]}/${id}`;
}

// ——— reading ———

function iso(d: Date | null): string | null {
  return d ? d.toISOString() : null;
}

async function suppliersById(sequelize: Sequelize, ids: (number | null)[], transaction?: Transaction): Promise<Map<number, SupplierRef>> {
  const wanted = [...new Set(ids.filter((i): i is number => i !== null))];
  const map = new Map<number, SupplierRef>();
  if (wanted.length === 0) return map;
  const rows = await sequelize.query<SupplierRef>('SELECT id, name FROM suppliers WHERE id IN (:ids)', {
    replacements: { ids: wanted },
    type: QueryTypes.SELECT,
    transaction,
  });
  for (const r of rows) map.set(r.id, r);
  return map;
}

function summaryOf(r: LibraryRevision, entry: LibraryEntry, users: Map<number, UserRef>): RevisionSummary {
  return {
    number: r.number,
    state: r.state,
    name: r.name,
    superseded: r.state === 'approved' && r.id !== entry.approvedRevisionId,
    createdBy: refOf(users, r.createdBy),
    createdAt: r.createdAt.toISOString(),
    updatedBy: refOf(users, r.updatedBy),
    updatedAt: r.updatedAt.toISOString(),
    submittedBy: refOf(users, r.submittedBy),
    submittedAt: iso(r.submittedAt),
    reviewedBy: refOf(users, r.reviewedBy),
    reviewedAt: iso(r.reviewedAt),
    reviewComment: r.reviewComment,
  };
}

function revisionOf(r: LibraryRevision, entry: LibraryEntry, users: Map<number, UserRef>, suppliers: Map<number, SupplierRef>): Revision {
  return {
    ...summaryOf(r, entry, users),
    supplier: r.supplierId === null ? null : (suppliers.get(r.supplierId) ?? { id: r.supplierId, name: '(unknown)' }),
    notes: r.notes,
    data: r.data,
  };
}

/** Who took part in a revision: they may not decide on it (four-eyes). */
function authorsOf(r: LibraryRevision): number[] {
  return [r.createdBy, r.updatedBy, r.submittedBy].filter((id): id is number => id !== null);
}

function actionsFor(user: SessionUser, head: LibraryRevision): EntryActions {
  const canEdit = rolesAllow(user.roles, 'library:edit');
  const canReview = rolesAllow(user.roles, 'library:review');
  const own = authorsOf(head).includes(user.id);
  const reviewable = canReview && head.state === 'in-review';
  return {
    edit: canEdit && EDITABLE_STATES.includes(head.state),
    submit: canEdit && (head.state === 'draft' || head.state === 'returned'),
    approve: reviewable && !own,
    return: reviewable && !own,
    deleteDraft: canEdit && head.state === 'draft',
    ...(reviewable && own ? { reviewBlockedReason: 'You created, edited or submitted this revision: a second reviewer must decide on it.' } : {}),
  };
}

async function loadEntry(ctx: LibraryContext, kind: LibraryKind, id: number, transaction?: Transaction, lock = false): Promise<LibraryEntry> {
  const entry = await ctx.models.Entry.findOne({
    where: { id, kind },
    transaction,
    ...(lock && transaction ? { lock: transaction.LOCK.UPDATE } : {}),
  });
  if (!entry || entry.headRevisionId === null) {
    throw new AppError(404, 'not-found', `There is no ${KIND_WORDS[kind]} with id ${id}.`);
  }
  return entry;
}

async function detailOf(ctx: LibraryContext, entry: LibraryEntry, user: SessionUser, transaction?: Transaction): Promise<EntryDetail> {
  const revisions = await ctx.models.Revision.findAll({ where: { entryId: entry.id }, order: [['number', 'DESC']], transaction });
  const head = revisions.find((r) => r.id === entry.headRevisionId);
  if (!head) throw new AppError(500, 'internal', `Entry ${entry.id} has no head revision.`);
  const approved = entry.approvedRevisionId !== null && entry.approvedRevisionId !== head.id ? revisions.find((r) => r.id === entry.approvedRevisionId) : undefined;
  const users = await userRefs(ctx.sequelize, revisions.flatMap((r) => [...authorsOf(r), r.reviewedBy]), transaction);
  const suppliers = await suppliersById(ctx.sequelize, [head.supplierId, approved?.supplierId ?? null], transaction);
  return {
    id: entry.id,
    kind: entry.kind,
    version: entry.version,
    head: revisionOf(head, entry, users, suppliers),
    approved: approved ? revisionOf(approved, entry, users, suppliers) : null,
    revisions: revisions.map((r) => summaryOf(r, entry, users)),
    actions: actionsFor(user, head),
  };
}

export async function getEntry(ctx: LibraryContext, kind: LibraryKind, id: number, user: SessionUser): Promise<EntryDetail> {
  return detailOf(ctx, await loadEntry(ctx, kind, id), user);
}

export async function listRevisions(ctx: LibraryContext, kind: LibraryKind, id: number): Promise<RevisionSummary[]> {
  const entry = await loadEntry(ctx, kind, id);
  const revisions = await ctx.models.Revision.findAll({ where: { entryId: id }, order: [['number', 'DESC']] });
  const users = await userRefs(ctx.sequelize, revisions.flatMap((r) => [...authorsOf(r), r.reviewedBy]));
  return revisions.map((r) => summaryOf(r, entry, users));
}

async function loadRevision(ctx: LibraryContext, entry: LibraryEntry, number: number): Promise<LibraryRevision> {
  const r = await ctx.models.Revision.findOne({ where: { entryId: entry.id, number } });
  if (!r) throw new AppError(404, 'not-found', `Entry ${entry.id} has no revision ${number}.`);
  return r;
}

export async function getRevision(ctx: LibraryContext, kind: LibraryKind, id: number, number: number): Promise<Revision> {
  const entry = await loadEntry(ctx, kind, id);
  const r = await loadRevision(ctx, entry, number);
  const users = await userRefs(ctx.sequelize, [...authorsOf(r), r.reviewedBy]);
  return revisionOf(r, entry, users, await suppliersById(ctx.sequelize, [r.supplierId]));
}

/** Differences from revision `from` to revision `to` in name, supplier, notes and data. */
export async function diffRevisions(ctx: LibraryContext, kind: LibraryKind, id: number, from: number, to: number): Promise<RevisionDiff> {
  const entry = await loadEntry(ctx, kind, id);
  const [a, b] = await Promise.all([loadRevision(ctx, entry, from), loadRevision(ctx, entry, to)]);
  const suppliers = await suppliersById(ctx.sequelize, [a.supplierId, b.supplierId]);
  const view = (r: LibraryRevision) => ({
    name: r.name,
    supplier: r.supplierId === null ? null : (suppliers.get(r.supplierId)?.name ?? r.supplierId),
    notes: r.notes,
    data: r.data,
  });
  return { from, to, changes: jsonDiff(view(a), view(b)) };
}

// ——— list ———

/** Key figures shown in the tables, from the head revision's data. */
export function figuresOf(kind: LibraryKind, data: LibraryData): Record<string, EntryFigure> {
  const out: Record<string, EntryFigure> = {};
  const put = (key: string, v: { si: number; unit: string } | undefined) => {
    if (v) out[key] = { si: v.si, unit: v.unit };
  };
  if (kind === 'fibre') {
    const f = data as FibreData;
    out['polymer'] = { text: f.polymer };
    put('linearDensity', f.linearDensity);
    put('diameter', f.diameter);
    put('density', f.density);
  } else if (kind === 'web') {
    const w = data as WebData;
    out['webKind'] = { text: w.webKind };
    put('basisWeight', w.basisWeight);
    put('thickness', w.thickness);
    put('porosity', w.porosity);
    put('meanFlowPoreSize', w.meanFlowPoreSize);
  } else {
    const l = data as LiquidData;
    for (const key of ['surfaceTension', 'viscosity', 'density'] as const) {
      const figure = liquidFigure(l[key]);
      if (figure) out[key] = figure;
    }
  }
  return out;
}

/** A liquid property at 20 °C for the table: the constant, or the table interpolated (ends held). */
function liquidFigure(p: LiquidPropertyData): EntryFigure | undefined {
  if (p.mode === 'constant') return { si: p.value.si, unit: p.value.unit };
  try {
    return { si: interpolateTable(p.points, 293.15).value, unit: p.unit };
  } catch (e) {
    if (e instanceof DomainError) return undefined;
    throw e;
  }
}

/** SQL for each sortable column; figure keys read the head revision's JSON. Never built from user text. */
const num = (path: string) => `NULLIF(r.data #>> '{${path}}', '')::float8`;
const SORTS: Record<LibraryKind | 'any', Record<string, string>> = {
  any: { name: 'lower(r.name)', updatedAt: 'e.updated_at', state: 'r.state', supplier: 'lower(s.name)', kind: 'e.kind' },
  fibre: {
    polymer: `lower(r.data ->> 'polymer')`,
    linearDensity: num('linearDensity,si'),
    diameter: num('diameter,si'),
    density: num('density,si'),
  },
  web: {
    webKind: `r.data ->> 'webKind'`,
    basisWeight: num('basisWeight,si'),
    thickness: num('thickness,si'),
    porosity: num('porosity,si'),
    meanFlowPoreSize: num('meanFlowPoreSize,si'),
  },
  liquid: {
    surfaceTension: `COALESCE(${num('surfaceTension,value,si')}, ${num('surfaceTension,points,0,value')})`,
    viscosity: `COALESCE(${num('viscosity,value,si')}, ${num('viscosity,points,0,value')})`,
    density: `COALESCE(${num('density,value,si')}, ${num('density,points,0,value')})`,
  },
};

interface ListRow {
  id: number;
  kind: LibraryKind;
  version: number;
  updated_at: Date;
  name: string;
  state: RevisionState;
  number: number;
  data: LibraryData;
  supplier_id: number | null;
  supplier_name: string | null;
  updated_by: number;
  submitted_by: number | null;
  approved_number: number | null;
  total: string;
}

/** One page of entries (head revisions), filtered and sorted on the server. */
export async function listEntries(ctx: LibraryContext, kind: LibraryKind | undefined, q: ListQueryInput): Promise<Page<EntrySummary>> {
  const sorts = { ...SORTS.any, ...(kind ? SORTS[kind] : {}) };
  const order = sorts[q.sort];
  if (!order) {
    throw new AppError(422, 'validation-failed', `Cannot sort by "${q.sort}".`, {
      issues: [{ field: 'sort', rule: 'enum', message: `Use one of: ${Object.keys(sorts).join(', ')}.` }],
    });
  }
  const where: string[] = [];
  const replacements: Record<string, unknown> = {};
  if (kind ?? q.kind) {
    where.push('e.kind = :kind');
    replacements['kind'] = kind ?? q.kind;
  }
  if (q.q) {
    where.push(`(r.name ILIKE :like OR r.notes ILIKE :like)`);
    replacements['like'] = `%${q.q.replace(/[\\%_]/g, (c) => '\\' + c)}%`;
  }
  if (q.state) {
    where.push('r.state = :state');
    replacements['state'] = q.state;
  }
  if (q.supplierId) {
    where.push('r.supplier_id = :supplierId');
    replacements['supplierId'] = q.supplierId;
  }
  if (q.type) {
    where.push(`(r.data ->> 'webKind' = :type OR r.data ->> 'polymer' ILIKE :type)`);
    replacements['type'] = q.type;
  }
  const dir = q.dir === 'desc' ? 'DESC' : 'ASC';
  const rows = await ctx.sequelize.query<ListRow>(
    `SELECT e.id, e.kind, e.version, e.updated_at, r.name, r.state, r.number, r.data, r.supplier_id,
            s.name AS supplier_name, r.updated_by, r.submitted_by, ar.number AS approved_number,
            count(*) OVER () AS total
       FROM library_entries e
       JOIN library_revisions r ON r.id = e.head_revision_id
       LEFT JOIN library_revisions ar ON ar.id = e.approved_revision_id
       LEFT JOIN suppliers s ON s.id = r.supplier_id
      ${where.length ? 'WHERE ' + where.join(' AND ') : ''}
      ORDER BY ${order} ${dir} NULLS LAST, e.id ASC
      LIMIT :limit OFFSET :offset`,
    { replacements: { ...replacements, limit: q.pageSize, offset: (q.page - 1) * q.pageSize }, type: QueryTypes.SELECT },
  );
  let total = rows.length ? Number(rows[0].total) : 0;
  if (rows.length === 0 && q.page > 1) {
    // Past the last page: still report how many there are.
    const [c] = await ctx.sequelize.query<{ n: string }>(
      `SELECT count(*) AS n FROM library_entries e JOIN library_revisions r ON r.id = e.head_revision_id
         LEFT JOIN suppliers s ON s.id = r.supplier_id ${where.length ? 'WHERE ' + where.join(' AND ') : ''}`,
      { replacements, type: QueryTypes.SELECT },
    );
    total = Number(c.n);
  }
  const users = await userRefs(ctx.sequelize, rows.flatMap((r) => [r.updated_by, r.submitted_by]));
  return {
    items: rows.map((r) => ({
      id: r.id,
      kind: r.kind,
      version: r.version,
      name: r.name,
      supplier: r.supplier_id === null ? null : { id: r.supplier_id, name: r.supplier_name ?? '(unknown)' },
      state: r.state,
      headRevision: r.number,
      approvedRevision: r.approved_number,
      updatedAt: new Date(r.updated_at).toISOString(),
      updatedBy: refOf(users, r.updated_by),
      submittedBy: refOf(users, r.submitted_by),
      figures: figuresOf(r.kind, r.data),
    })),
    total,
    page: q.page,
    pageSize: q.pageSize,
  };
}

export async function listSuppliers(ctx: LibraryContext): Promise<SupplierRef[]> {
  return ctx.sequelize.query<SupplierRef>('SELECT id, name FROM suppliers ORDER BY name', { type: QueryTypes.SELECT });
}

// ——— checks and derived values on save ———

function invalid(field: string, rule: string, message: string): AppError {
  return new AppError(422, 'validation-failed', `Invalid body: ${field} — ${message}`, { issues: [{ field, rule, message }] });
}

async function checkSupplier(ctx: LibraryContext, supplierId: number | null, transaction: Transaction): Promise<void> {
  if (supplierId === null) return;
  const found = await suppliersById(ctx.sequelize, [supplierId], transaction);
  if (!found.has(supplierId)) throw invalid('supplierId', 'exists', `There is no supplier with id ${supplierId}.`);
}

async function checkFileRefs(ctx: LibraryContext, refs: { field: string; ref: FileRef | undefined }[], transaction: Transaction): Promise<void> {
  for (const { field, ref } of refs) {
    if (!ref) continue;
    const f = await ctx.models.File.findByPk(ref.fileId, { attributes: ['id', 'sha256'], transaction });
    if (!f || f.sha256 !== ref.sha256) throw invalid(field, 'exists', `File ${ref.fileId} with that checksum was not uploaded here.`);
  }
}

/** The fibre data a web's blend refers to: the approved revision, or the newest when none is approved yet. */
async function blendFibreData(ctx: LibraryContext, fibreId: number, transaction: Transaction): Promise<FibreData | null> {
  const entry = await ctx.models.Entry.findOne({ where: { id: fibreId, kind: 'fibre' }, transaction });
  const revId = entry?.approvedRevisionId ?? entry?.headRevisionId;
  if (!revId) return null;
  const r = await ctx.models.Revision.findByPk(revId, { transaction });
  return r ? (r.data as FibreData) : null;
}

const COMPUTED_POROSITY_NOTE = 'Computed: ε = 1 − BW/(ρf·t) from basis weight, thickness and the blend fibre density (wick-core fibre-bed).';

/**
 * Checks references a schema cannot see (supplier, blend fibres, files) and derives computed values: a web with
 * `porosityMode: 'computed'` gets ε from basis weight, thickness and its library fibres' densities when they are
 * all known, and no porosity otherwise.
 */
async function prepare(ctx: LibraryContext, kind: LibraryKind, input: RevisionInput, transaction: Transaction): Promise<LibraryData> {
  await checkSupplier(ctx, input.supplierId, transaction);
  if (kind !== 'web') return input.data;
  const web = input.data as WebData;
  const components: BlendComponent[] = [];
  let complete = true;
  for (const [i, part] of web.blend.entries()) {
    if (part.fibreId === undefined) {
      complete = false;
      continue;
    }
    const fibre = await blendFibreData(ctx, part.fibreId, transaction);
    if (!fibre) throw invalid(`data.blend.${i}.fibreId`, 'exists', `There is no fibre with id ${part.fibreId} in the library.`);
    components.push({
      name: part.fibreName,
      massFraction: part.massFraction,
      fibreDensity: fibre.density.si,
      diameter: fibre.diameter?.si,
      linearDensity: fibre.linearDensity?.si,
      shapeFactor: fibre.shapeFactor?.si,
    });
  }
  await checkFileRefs(
    ctx,
    [
      { field: 'data.poreSizeDistribution.file', ref: web.poreSizeDistribution?.file },
      ...web.curves.map((c, i) => ({ field: `data.curves.${i}.file`, ref: c.file })),
    ],
    transaction,
  );
  if (web.porosityMode !== 'computed') return web;
  const { porosity: _dropped, ...rest } = web;
  if (!complete || !web.thickness) return rest;
  try {
    const blend = blendFibres(components);
    const result = webPorosity({ basisWeight: web.basisWeight.si, thickness: web.thickness.si, fibreDensity: blend.fibreDensity });
    return { ...rest, porosity: { si: result.porosity, unit: '%', source: 'estimate', note: COMPUTED_POROSITY_NOTE } };
  } catch (e) {
    if (e instanceof DomainError) throw invalid(`data.${e.field ?? 'thickness'}`, e.code, e.message);
    throw e;
  }
}

// ——— changes ———

function conflict(current: EntryDetail, had: number): AppError {
  return new AppError(
    409,
    'version-conflict',
    `This entry changed since you opened it (you had version ${had}, it is now ${current.version}). ` +
      'Your change was not saved: look at the current version and make your change again.',
    { current },
  );
}

interface Locked {
  readonly entry: LibraryEntry;
  readonly head: LibraryRevision;
  readonly t: Transaction;
}

/** Runs `fn` in a transaction with the entry row locked and its version checked. */
async function withLockedEntry<T>(
  ctx: LibraryContext,
  kind: LibraryKind,
  id: number,
  version: number,
  user: SessionUser,
  fn: (locked: Locked) => Promise<T>,
): Promise<T> {
  return ctx.sequelize.transaction(async (t) => {
    const entry = await loadEntry(ctx, kind, id, t, true);
    if (entry.version !== version) throw conflict(await detailOf(ctx, entry, user, t), version);
    const head = await ctx.models.Revision.findByPk(entry.headRevisionId!, { transaction: t, lock: t.LOCK.UPDATE });
    if (!head) throw new AppError(500, 'internal', `Entry ${id} has no head revision.`);
    return fn({ entry, head, t });
  });
}

async function bump(entry: LibraryEntry, t: Transaction, patch: Partial<Pick<LibraryEntry, 'headRevisionId' | 'approvedRevisionId'>> = {}): Promise<void> {
  entry.set({ ...patch, version: entry.version + 1, updatedAt: new Date() });
  entry.changed('updatedAt', true);
  await entry.save({ transaction: t });
}

function stateError(head: LibraryRevision, wanted: string): AppError {
  return new AppError(409, 'wrong-state', `Revision ${head.number} is ${head.state.replace('-', ' ')}: it cannot be ${wanted}.`, {
    state: head.state,
  });
}

export async function createEntry(ctx: LibraryContext, kind: LibraryKind, input: RevisionInput, user: SessionUser): Promise<EntryDetail> {
  const id = await ctx.sequelize.transaction((t) => createEntryIn(ctx, kind, input, user, t, {}));
  return detailOf(ctx, await loadEntry(ctx, kind, id), user);
}

/**
 * Saves a change. A draft or returned head is changed in place (a returned one becomes a draft again, the
 * reviewer's comment kept); an approved head stays untouched and a new draft revision is started.
 */
export async function updateEntry(
  ctx: LibraryContext,
  kind: LibraryKind,
  id: number,
  input: RevisionInput & { version: number },
  user: SessionUser,
): Promise<EntryDetail> {
  const entry = await withLockedEntry(ctx, kind, id, input.version, user, async ({ entry, head, t }) => {
    const data = await prepare(ctx, kind, input, t);
    let number = head.number;
    if (head.state === 'in-review') throw stateError(head, 'edited while in review (ask a reviewer to return it)');
    if (head.state === 'approved') {
      number = head.number + 1;
      const r = await ctx.models.Revision.create(
        { entryId: entry.id, number, name: input.name, supplierId: input.supplierId, notes: input.notes, data, createdBy: user.id, updatedBy: user.id },
        { transaction: t },
      );
      await bump(entry, t, { headRevisionId: r.id });
    } else {
      head.set({ name: input.name, supplierId: input.supplierId, notes: input.notes, data, updatedBy: user.id, state: 'draft' });
      await head.save({ transaction: t });
      await bump(entry, t);
    }
    await audit(t, {
      actorId: user.id,
      action: 'update',
      entityType: 'library-entry',
      entityId: entry.id,
      details: { kind, name: input.name, revision: number, newRevision: number !== head.number },
    });
    return entry;
  });
  return detailOf(ctx, entry, user);
}

export async function submitEntry(ctx: LibraryContext, kind: LibraryKind, id: number, version: number, user: SessionUser): Promise<EntryDetail> {
  const entry = await withLockedEntry(ctx, kind, id, version, user, async ({ entry, head, t }) => {
    if (head.state !== 'draft' && head.state !== 'returned') throw stateError(head, 'submitted');
    head.set({ state: 'in-review', submittedBy: user.id, submittedAt: new Date(), reviewedBy: null, reviewedAt: null });
    await head.save({ transaction: t });
    await bump(entry, t);
    await audit(t, { actorId: user.id, action: 'submit', entityType: 'library-entry', entityId: entry.id, details: { kind, name: head.name, revision: head.number } });
    const submitter = await person(ctx.sequelize, user.id, t);
    const to = (await reviewers(ctx.sequelize, t)).filter((r) => !authorsOf(head).includes(r.id) && r.email !== submitter?.email);
    const link = ctx.mail.publicUrl + entryPath(kind, entry.id);
    await ctx.outbox.enqueue(
      t,
      to.map<OutboxMessage>((r) => ({
        to: r.email,
        subject: `Review requested: ${KIND_WORDS[kind]} "${head.name}", revision ${head.number}`,
        text:
          `Hello ${r.name},\n\n${submitter?.name ?? 'A materials scientist'} submitted revision ${head.number} of the ` +
          `${KIND_WORDS[kind]} "${head.name}" for review.\n\nOpen it: ${link}\n\n` +
          'Approve it if the data and their sources hold up, or return it with a comment.\n\n— Wickwright',
      })),
    );
    return entry;
  });
  return detailOf(ctx, entry, user);
}

async function decide(
  ctx: LibraryContext,
  kind: LibraryKind,
  id: number,
  version: number,
  user: SessionUser,
  decision: 'approve' | 'return',
  comment: string | undefined,
): Promise<EntryDetail> {
  const entry = await withLockedEntry(ctx, kind, id, version, user, async ({ entry, head, t }) => {
    if (head.state !== 'in-review') throw stateError(head, decision === 'approve' ? 'approved' : 'returned');
    if (authorsOf(head).includes(user.id)) {
      throw new AppError(403, 'four-eyes', 'You created, edited or submitted this revision: a second reviewer must decide on it.');
    }
    head.set({
      state: decision === 'approve' ? 'approved' : 'returned',
      reviewedBy: user.id,
      reviewedAt: new Date(),
      reviewComment: comment && comment.length > 0 ? comment : null,
    });
    await head.save({ transaction: t });
    await bump(entry, t, decision === 'approve' ? { approvedRevisionId: head.id } : {});
    await audit(t, {
      actorId: user.id,
      action: decision,
      entityType: 'library-entry',
      entityId: entry.id,
      details: { kind, name: head.name, revision: head.number, ...(comment ? { comment } : {}) },
    });
    const submitter = head.submittedBy === null ? null : await person(ctx.sequelize, head.submittedBy, t);
    const reviewer = await person(ctx.sequelize, user.id, t);
    if (submitter && submitter.email) {
      const verb = decision === 'approve' ? 'approved' : 'returned';
      const link = ctx.mail.publicUrl + entryPath(kind, entry.id);
      await ctx.outbox.enqueue(t, [
        {
          to: submitter.email,
          subject: `${decision === 'approve' ? 'Approved' : 'Returned'}: ${KIND_WORDS[kind]} "${head.name}", revision ${head.number}`,
          text:
            `Hello ${submitter.name},\n\n${reviewer?.name ?? 'A reviewer'} ${verb} revision ${head.number} of the ` +
            `${KIND_WORDS[kind]} "${head.name}".\n\n` +
            (comment ? `Comment: ${comment}\n\n` : '') +
            (decision === 'approve'
              ? 'It is now the revision in force.\n\n'
              : 'Change it and submit it again when it is ready.\n\n') +
            `Open it: ${link}\n\n— Wickwright`,
        },
      ]);
    }
    return entry;
  });
  return detailOf(ctx, entry, user);
}

export function approveEntry(ctx: LibraryContext, kind: LibraryKind, id: number, version: number, comment: string | undefined, user: SessionUser): Promise<EntryDetail> {
  return decide(ctx, kind, id, version, user, 'approve', comment);
}

export function returnEntry(ctx: LibraryContext, kind: LibraryKind, id: number, version: number, comment: string, user: SessionUser): Promise<EntryDetail> {
  return decide(ctx, kind, id, version, user, 'return', comment);
}

/**
 * Deletes the head revision when it is a draft. An entry that had nothing else disappears; otherwise the
 * approved revision in force becomes the head again. Returns the entry, or null when it was deleted.
 */
export async function deleteDraft(ctx: LibraryContext, kind: LibraryKind, id: number, version: number, user: SessionUser): Promise<EntryDetail | null> {
  const remaining = await withLockedEntry(ctx, kind, id, version, user, async ({ entry, head, t }) => {
    if (head.state !== 'draft') throw stateError(head, 'deleted (only drafts can be)');
    const details = { kind, name: head.name, revision: head.number };
    if (entry.approvedRevisionId === null) {
      await ctx.models.Upload.destroy({ where: { entryId: entry.id }, transaction: t });
      await bump(entry, t, { headRevisionId: null });
      await head.destroy({ transaction: t });
      await entry.destroy({ transaction: t });
      await audit(t, { actorId: user.id, action: 'delete', entityType: 'library-entry', entityId: id, details: { ...details, entryDeleted: true } });
      return null;
    }
    await bump(entry, t, { headRevisionId: entry.approvedRevisionId });
    await head.destroy({ transaction: t });
    await audit(t, { actorId: user.id, action: 'delete', entityType: 'library-entry', entityId: id, details: { ...details, entryDeleted: false } });
    return entry;
  });
  return remaining ? detailOf(ctx, remaining, user) : null;
}

/**
 * Replaces part of the head's data (an uploaded distribution or curve) as an ordinary edit: same locking, same
 * "approved starts a new draft" rule, same audit. Used by the upload commit.
 */
export async function patchEntryData(
  ctx: LibraryContext,
  kind: LibraryKind,
  id: number,
  version: number,
  user: SessionUser,
  patch: (data: LibraryData) => LibraryData,
  t: Transaction,
): Promise<void> {
  const entry = await loadEntry(ctx, kind, id, t, true);
  if (entry.version !== version) throw conflict(await detailOf(ctx, entry, user, t), version);
  const head = await ctx.models.Revision.findByPk(entry.headRevisionId!, { transaction: t, lock: t.LOCK.UPDATE });
  if (!head) throw new AppError(500, 'internal', `Entry ${id} has no head revision.`);
  if (head.state === 'in-review') throw stateError(head, 'changed while in review (ask a reviewer to return it)');
  const data = patch(head.data);
  if (head.state === 'approved') {
    const r = await ctx.models.Revision.create(
      { entryId: entry.id, number: head.number + 1, name: head.name, supplierId: head.supplierId, notes: head.notes, data, createdBy: user.id, updatedBy: user.id },
      { transaction: t },
    );
    await bump(entry, t, { headRevisionId: r.id });
  } else {
    head.set({ data, updatedBy: user.id, state: 'draft' });
    await head.save({ transaction: t });
    await bump(entry, t);
  }
  await audit(t, { actorId: user.id, action: 'update', entityType: 'library-entry', entityId: id, details: { kind, name: head.name, upload: true } });
}

/** Creates an entry with its first draft revision inside the caller's transaction (an import commits all rows or none). */
export async function createEntryIn(ctx: LibraryContext, kind: LibraryKind, input: RevisionInput, user: SessionUser, t: Transaction, auditDetails: Record<string, unknown>): Promise<number> {
  const data = await prepare(ctx, kind, input, t);
  const e = await ctx.models.Entry.create({ kind, headRevisionId: null, approvedRevisionId: null, createdBy: user.id }, { transaction: t });
  const r = await ctx.models.Revision.create(
    { entryId: e.id, number: 1, name: input.name, supplierId: input.supplierId, notes: input.notes, data, createdBy: user.id, updatedBy: user.id },
    { transaction: t },
  );
  e.headRevisionId = r.id;
  await e.save({ transaction: t });
  await audit(t, { actorId: user.id, action: 'create', entityType: 'library-entry', entityId: e.id, details: { kind, name: input.name, revision: 1, ...auditDetails } });
  return e.id;
}

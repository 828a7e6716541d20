/**
 * Lab data use cases: upload a measured wicking run (CSV read by the library's curve reader), list and read runs
 * with their fits, change the fit settings, group replicates in sets with mean, spread and outliers, the
 * reference-liquid contact angle of two sets, prediction versus measurement for a design variant, and proposing a
 * set's fitted values to the library as a new web revision that goes through review.
 *
 * Rules enforced here: a run is saved only when its file parses, its curve passes wick-core's data checks and its
 * Washburn slope can be fitted (bad data → 422, nothing stored); runs of a set share web, liquid, orientation and
 * measured quantity; every change names the version it was based on (409 otherwise) and writes an audit row.
 */
import { Op, QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import {
  analyseLabRun,
  checkUptakeSeries,
  type ContactAngleAnalysis,
  type CurveMeasurement,
  DEFAULT_FIT_SETTINGS,
  evaluateVariant,
  type FileRef,
  type FitSettings,
  formatQuantity,
  isDomainError,
  type LabCurve,
  labRunFigures,
  type LabRunFitInput,
  labRunWashburnFit,
  type LabProposal,
  type LabRunCreate,
  type LabRunDetail,
  type LabRunSummary,
  type LabRunUpdate,
  type LabSetDetail,
  type LabSetSummary,
  type LabSetUpdate,
  type LiquidData,
  liquidAt,
  liquidFromLibrary,
  MIN_RUN_POINTS,
  type ModelWarning,
  ORIENTATION_CONFIGURATION,
  type PredictionCandidate,
  type PredictionComparison,
  predictionError,
  type ProposeRequest,
  REFERENCE_LIQUID_CAUTION,
  referenceLiquidContactAngle,
  replicateFigures,
  rolesAllow,
  type RunAnalysis,
  type RunLiquid,
  type RunLiquidChoice,
  runLiquidOf,
  type RunWeb,
  toPlain,
  type UserRef,
  type VariantConfiguration,
  type VariantInputs,
  type WebData,
  WICK_CORE_VERSION,
} from 'wick-core';
import type { SessionUser } from '../auth/authorize';
import { AppError } from '../errors';
import { type LabModels, type LabRun, type LabSet, labModels } from '../models';
import { parseCurveCsv } from '../uploads/curve-csv';
import { readCsvTable, reject, type UploadedFile } from '../uploads/csv-table';
import { fieldIssues } from '../routes/validate';
import { webDataSchema } from '../schemas/library';
import { audit } from './audit';
import { type LibraryContext, patchEntryData, submitEntry } from './library';
import { refOf, userRefs } from './library-people';
import { storeFile, UPLOAD_LIMITS } from './library-uploads';

export interface LabContext {
  readonly sequelize: Sequelize;
  readonly models: LabModels;
  readonly library: LibraryContext;
  /** Base of links written into library revisions. */
  readonly publicUrl: string;
}

export function labContext(sequelize: Sequelize, library: LibraryContext, publicUrl: string): LabContext {
  return { sequelize, models: labModels(sequelize), library, publicUrl };
}

/** Where the UI shows a set (links in library notes). */
export function setPath(id: number): string {
  return `/lab-data/sets/${id}`;
}

function invalid(field: string, rule: string, message: string): AppError {
  return new AppError(422, 'validation-failed', `Invalid input: ${field} — ${message}`, { issues: [{ field, rule, message }] });
}

function conflict(what: string, had: number, now: number, current: unknown): AppError {
  return new AppError(
    409,
    'version-conflict',
    `This ${what} changed since you opened it (you had version ${had}, it is now ${now}). Nothing was saved: reload and make your change again.`,
    { current },
  );
}

const iso = (d: Date): string => d.toISOString();

// ——— resolving the specimen and the liquid ———

async function resolveWeb(ctx: LabContext, webId: number, revision: number | undefined, t?: Transaction): Promise<RunWeb> {
  const { Entry, Revision } = ctx.library.models;
  const entry = await Entry.findOne({ where: { id: webId, kind: 'web' }, transaction: t });
  if (!entry || entry.headRevisionId === null) throw invalid('webId', 'exists', `There is no web with id ${webId} in the library.`);
  const rev =
    revision !== undefined
      ? await Revision.findOne({ where: { entryId: webId, number: revision }, transaction: t })
      : await Revision.findByPk(entry.approvedRevisionId ?? entry.headRevisionId, { transaction: t });
  if (!rev) throw invalid('webRevision', 'exists', `Web ${webId} has no revision ${revision}.`);
  const data = rev.data as WebData;
  return { entryId: webId, revision: rev.number, name: rev.name, state: rev.state, porosity: data.porosity?.si ?? null };
}

/** The liquid's identity and its properties at `temperature` (K), with the key runs of one set must share. */
async function resolveLiquid(ctx: LabContext, choice: RunLiquidChoice, temperature: number, t?: Transaction): Promise<{ key: string; liquid: RunLiquid }> {
  if ('builtInId' in choice) {
    const p = liquidAt(choice.builtInId, temperature);
    return {
      key: `built-in:${choice.builtInId}`,
      liquid: runLiquidOf(p, { source: 'built-in', builtInId: choice.builtInId, entryId: null, revision: null }),
    };
  }
  const { Entry, Revision } = ctx.library.models;
  const entry = await Entry.findOne({ where: { id: choice.entryId, kind: 'liquid' }, transaction: t });
  if (!entry || entry.headRevisionId === null) throw invalid('liquid.entryId', 'exists', `There is no liquid with id ${choice.entryId} in the library.`);
  const rev =
    choice.revision !== undefined
      ? await Revision.findOne({ where: { entryId: entry.id, number: choice.revision }, transaction: t })
      : await Revision.findByPk(entry.approvedRevisionId ?? entry.headRevisionId, { transaction: t });
  if (!rev) throw invalid('liquid.revision', 'exists', `Liquid ${entry.id} has no revision ${choice.revision}.`);
  const definition = liquidFromLibrary({ kind: 'liquid', id: entry.id, revision: rev.number, name: rev.name, state: rev.state, data: rev.data as LiquidData });
  return {
    key: `library:${entry.id}`,
    liquid: runLiquidOf(liquidAt(definition, temperature), { source: 'library', builtInId: null, entryId: entry.id, revision: rev.number }),
  };
}

function tiltOf(meta: Pick<LabRunCreate, 'orientation' | 'tilt'>): number {
  if (meta.orientation === 'vertical') return Math.PI / 2;
  if (meta.orientation === 'horizontal') return 0;
  const tilt = meta.tilt;
  if (tilt === undefined || !(tilt > 0 && tilt < Math.PI / 2)) {
    throw invalid('tilt', 'range', 'An inclined run needs its tilt from horizontal, between 0° and 90° (exclusive).');
  }
  return tilt;
}

// ——— reading ———

function runData(r: Pick<LabRun, 'times' | 'readings' | 'measurement' | 'orientation' | 'tilt' | 'liquid' | 'web' | 'fit'>): LabRunFitInput {
  return {
    times: r.times,
    readings: r.readings,
    measurement: r.measurement,
    orientation: r.orientation,
    tilt: r.tilt,
    liquid: r.liquid,
    porosity: r.web.porosity,
    fit: r.fit,
  };
}

function summaryOf(r: LabRun, set: LabSet, users: Map<number, UserRef>, points = r.times.length): LabRunSummary {
  return {
    id: r.id,
    version: r.version,
    name: r.name,
    set: { id: set.id, name: set.name },
    web: r.web,
    liquidName: r.liquid.name,
    temperature: r.temperature,
    orientation: r.orientation,
    measurement: r.measurement,
    points,
    measuredAt: r.measuredAt,
    createdBy: refOf(users, r.createdBy),
    createdAt: iso(r.createdAt),
    figures: r.summary,
  };
}

async function loadRun(ctx: LabContext, id: number, t?: Transaction, lock = false): Promise<LabRun> {
  const run = await ctx.models.LabRun.findByPk(id, { transaction: t, ...(lock && t ? { lock: t.LOCK.UPDATE } : {}) });
  if (!run) throw new AppError(404, 'not-found', `There is no lab run with id ${id}.`);
  return run;
}

async function loadSet(ctx: LabContext, id: number, t?: Transaction, lock = false): Promise<LabSet> {
  const set = await ctx.models.LabSet.findByPk(id, { transaction: t, ...(lock && t ? { lock: t.LOCK.UPDATE } : {}) });
  if (!set) throw new AppError(404, 'not-found', `There is no lab set with id ${id}.`);
  return set;
}

async function fileRefOf(ctx: LabContext, fileId: number, t?: Transaction): Promise<FileRef> {
  const f = await ctx.library.models.File.findByPk(fileId, { attributes: ['id', 'fileName', 'sha256'], transaction: t });
  if (!f) throw new AppError(500, 'internal', `File ${fileId} of a lab run is missing.`);
  return { fileId: f.id, fileName: f.fileName, sha256: f.sha256 };
}

async function detailOf(ctx: LabContext, run: LabRun, user: SessionUser, t?: Transaction): Promise<LabRunDetail> {
  const set = await loadSet(ctx, run.setId, t);
  const users = await userRefs(ctx.sequelize, [run.createdBy, run.updatedBy], t);
  const canEdit = rolesAllow(user.roles, 'labdata:edit');
  const proposed = set.proposals.some((p) => p.runIds.includes(run.id));
  return {
    ...summaryOf(run, set, users),
    liquid: run.liquid,
    tilt: run.tilt,
    width: run.width,
    thickness: run.thickness,
    conditions: run.conditions,
    notes: run.notes,
    times: run.times,
    values: run.readings,
    timeUnit: run.timeUnit,
    valueUnit: run.valueUnit,
    file: await fileRefOf(ctx, run.fileId, t),
    fit: run.fit,
    analysis: analyseLabRun(runData(run)),
    updatedBy: refOf(users, run.updatedBy),
    updatedAt: iso(run.updatedAt),
    actions: { edit: canEdit, delete: canEdit && !proposed },
  };
}

export async function getRun(ctx: LabContext, id: number, user: SessionUser): Promise<LabRunDetail> {
  return detailOf(ctx, await loadRun(ctx, id), user);
}

export async function listRuns(ctx: LabContext, filter: { setId?: number; webId?: number }): Promise<LabRunSummary[]> {
  const where: Record<string, unknown> = {};
  if (filter.setId !== undefined) where['setId'] = filter.setId;
  if (filter.webId !== undefined) where['webEntryId'] = filter.webId;
  const runs = await ctx.models.LabRun.findAll({
    where,
    attributes: { exclude: ['times', 'readings'] },
    order: [['createdAt', 'DESC'], ['id', 'DESC']],
  });
  const sets = new Map((await ctx.models.LabSet.findAll({ where: { id: { [Op.in]: [...new Set(runs.map((r) => r.setId))] } } })).map((s) => [s.id, s]));
  const users = await userRefs(ctx.sequelize, runs.map((r) => r.createdBy));
  // `points` needs the length only: ask the database rather than loading every reading.
  const counts = new Map(
    (
      await ctx.sequelize.query<{ id: number; n: number }>('SELECT id, cardinality(times) AS n FROM lab_runs WHERE id IN (:ids)', {
        replacements: { ids: runs.length ? runs.map((r) => r.id) : [0] },
        type: QueryTypes.SELECT,
      })
    ).map((c) => [c.id, Number(c.n)]),
  );
  return runs.map((r) => summaryOf(r, sets.get(r.setId)!, users, counts.get(r.id) ?? 0));
}

// ——— creating, changing and deleting runs ———

/** The set a new run joins (locked), or a new one; runs of a set share web, liquid, orientation and quantity. */
async function setFor(
  ctx: LabContext,
  meta: LabRunCreate,
  identity: { webId: number; liquidKey: string; liquidName: string; measurement: CurveMeasurement },
  user: SessionUser,
  t: Transaction,
): Promise<LabSet> {
  if (meta.setId !== undefined) {
    const set = await ctx.models.LabSet.findByPk(meta.setId, { transaction: t, lock: t.LOCK.UPDATE });
    if (!set) throw invalid('setId', 'exists', `There is no lab set with id ${meta.setId}.`);
    const differs = [
      set.webEntryId !== identity.webId ? 'web' : null,
      set.liquidKey !== identity.liquidKey ? `liquid (the set uses ${set.liquidName})` : null,
      set.orientation !== meta.orientation ? `orientation (the set is ${set.orientation})` : null,
      set.measurement !== identity.measurement ? `measured quantity (the set has ${set.measurement}s)` : null,
    ].filter((x): x is string => x !== null);
    if (differs.length) {
      throw new AppError(
        422,
        'set-mismatch',
        `This run cannot join set "${set.name}": replicates share web, liquid, orientation and measured quantity, and this run differs in ${differs.join(', ')}. Nothing was saved.`,
        { issues: differs.map((d) => ({ field: 'setId', rule: 'same-conditions', message: `Differs in ${d}.` })) },
      );
    }
    set.set({ version: set.version + 1, updatedBy: user.id });
    await set.save({ transaction: t });
    return set;
  }
  const name = meta.newSetName!.trim();
  if (await ctx.models.LabSet.findOne({ where: { name }, transaction: t })) {
    throw new AppError(409, 'name-taken', `A lab set named "${name}" exists already: choose it, or give the new set another name.`);
  }
  return ctx.models.LabSet.create(
    {
      name,
      webEntryId: identity.webId,
      liquidKey: identity.liquidKey,
      liquidName: identity.liquidName,
      orientation: meta.orientation,
      measurement: identity.measurement,
      createdBy: user.id,
      updatedBy: user.id,
    },
    { transaction: t },
  );
}

/**
 * Reads the uploaded curve and checks it the way the fits will; the refusal lists each problem with its line
 * (422 `upload-invalid`), and nothing is stored.
 */
function readRunCurve(file: UploadedFile, measurement: CurveMeasurement | undefined) {
  const table = readCsvTable(file, UPLOAD_LIMITS.maxRows.curve);
  const parsed = parseCurveCsv(table, measurement);
  if (parsed.issues.length || !parsed.curve) throw reject(table.info, parsed.issues);
  const curve = parsed.curve;
  try {
    checkUptakeSeries(curve.times, curve.values, MIN_RUN_POINTS, curve.measurement);
    const n = curve.values.length;
    if (curve.values[n - 1] <= curve.values[0]) {
      const last = table.rows[n - 1]?.line ?? null;
      throw reject(table.info, [
        { line: last, message: `The ${curve.measurement} falls from the first to the last reading: a wicking record rises. Check the column order and the sign.` },
      ]);
    }
  } catch (e) {
    if (!isDomainError(e)) throw e;
    const index = e.details?.['index'];
    const line = typeof index === 'number' ? (table.rows[index]?.line ?? null) : null;
    const message =
      e.code === 'insufficient-data'
        ? `A lab run needs at least ${MIN_RUN_POINTS} readings to be fitted; the file has ${curve.times.length}.`
        : e.message;
    throw reject(table.info, [{ line, message }]);
  }
  return { table, curve, warnings: parsed.warnings };
}

export async function createRun(ctx: LabContext, meta: LabRunCreate, file: UploadedFile, user: SessionUser): Promise<LabRunDetail> {
  const tilt = tiltOf(meta);
  const web = await resolveWeb(ctx, meta.webId, meta.webRevision);
  const { key: liquidKey, liquid } = await resolveLiquid(ctx, meta.liquid, meta.temperature);
  const { table, curve } = readRunCurve(file, meta.measurement);
  const fit: FitSettings = DEFAULT_FIT_SETTINGS;
  const data = runData({ times: [...curve.times], readings: [...curve.values], measurement: curve.measurement, orientation: meta.orientation, tilt, liquid, web, fit });
  // A curve the Washburn slope cannot use (no growth of y² in time) is refused like any other bad data.
  try {
    labRunWashburnFit(data);
  } catch (e) {
    if (isDomainError(e)) throw reject(table.info, [{ line: null, message: e.message }]);
    throw e;
  }
  const summary = labRunFigures(analyseLabRun(data));
  const id = await ctx.sequelize.transaction(async (t) => {
    const set = await setFor(ctx, meta, { webId: web.entryId, liquidKey, liquidName: liquid.name, measurement: curve.measurement }, user, t);
    const f = await storeFile(ctx.library, 'curve', file, table, user, t);
    const run = await ctx.models.LabRun.create(
      {
        setId: set.id,
        name: meta.name.trim(),
        webEntryId: web.entryId,
        webRevision: web.revision,
        web,
        liquid,
        temperature: meta.temperature,
        orientation: meta.orientation,
        tilt,
        width: meta.width ?? null,
        thickness: meta.thickness ?? null,
        measurement: curve.measurement,
        times: [...curve.times],
        readings: [...curve.values],
        timeUnit: curve.timeUnit,
        valueUnit: curve.valueUnit,
        fileId: f.id,
        conditions: meta.conditions ?? '',
        notes: meta.notes ?? '',
        measuredAt: meta.measuredAt ?? null,
        fit,
        summary,
        coreVersion: WICK_CORE_VERSION,
        createdBy: user.id,
        updatedBy: user.id,
      },
      { transaction: t },
    );
    await audit(t, {
      actorId: user.id,
      action: 'create',
      entityType: 'lab-run',
      entityId: run.id,
      details: { name: run.name, setId: set.id, setName: set.name, webId: web.entryId, webRevision: web.revision, file: { fileId: f.id, fileName: f.fileName, sha256: f.sha256 } },
    });
    return run.id;
  });
  return getRun(ctx, id, user);
}

export async function updateRun(ctx: LabContext, id: number, update: LabRunUpdate, user: SessionUser): Promise<LabRunDetail> {
  await ctx.sequelize.transaction(async (t) => {
    const run = await loadRun(ctx, id, t, true);
    if (run.version !== update.version) throw conflict('run', update.version, run.version, await detailOf(ctx, run, user, t));
    const data: LabRunFitInput = { ...runData(run), fit: update.fit };
    // A window that leaves too few points is refused before anything is saved.
    labRunWashburnFit(data);
    run.set({
      name: update.name.trim(),
      conditions: update.conditions,
      notes: update.notes,
      fit: update.fit,
      summary: labRunFigures(analyseLabRun(data)),
      coreVersion: WICK_CORE_VERSION,
      version: run.version + 1,
      updatedBy: user.id,
    });
    await run.save({ transaction: t });
    await audit(t, { actorId: user.id, action: 'update', entityType: 'lab-run', entityId: run.id, details: { name: run.name, fit: update.fit } });
  });
  return getRun(ctx, id, user);
}

/** Deletes a run (not one whose values went into a proposal: it is the evidence). An emptied set goes too. */
export async function deleteRun(ctx: LabContext, id: number, version: number, user: SessionUser): Promise<void> {
  await ctx.sequelize.transaction(async (t) => {
    const run = await loadRun(ctx, id, t, true);
    if (run.version !== version) throw conflict('run', version, run.version, await detailOf(ctx, run, user, t));
    const set = await loadSet(ctx, run.setId, t, true);
    const proposal = set.proposals.find((p) => p.runIds.includes(run.id));
    if (proposal) {
      throw new AppError(
        409,
        'run-proposed',
        `Run "${run.name}" backs revision ${proposal.revision} of the web "${proposal.webName}" proposed to the library: it is kept as evidence.`,
      );
    }
    await run.destroy({ transaction: t });
    await ctx.library.models.File.destroy({ where: { id: run.fileId }, transaction: t });
    const left = await ctx.models.LabRun.count({ where: { setId: set.id }, transaction: t });
    if (left === 0 && set.proposals.length === 0) await set.destroy({ transaction: t });
    else {
      set.set({ version: set.version + 1, updatedBy: user.id });
      await set.save({ transaction: t });
    }
    await audit(t, { actorId: user.id, action: 'delete', entityType: 'lab-run', entityId: id, details: { name: run.name, setId: set.id, setDeleted: left === 0 && set.proposals.length === 0 } });
  });
}

/** The original bytes of a run's file. */
export async function runFile(ctx: LabContext, id: number) {
  const run = await loadRun(ctx, id);
  const f = await ctx.library.models.File.findByPk(run.fileId);
  if (!f) throw new AppError(404, 'not-found', `The file of lab run ${id} is missing.`);
  return f;
}

// ——— sets ———

function setSummaryOf(set: LabSet, runs: readonly LabRun[], users: Map<number, UserRef>): LabSetSummary {
  const newest = [...runs].sort((a, b) => b.id - a.id)[0];
  return {
    id: set.id,
    version: set.version,
    name: set.name,
    notes: set.notes,
    webId: set.webEntryId,
    webName: newest?.web.name ?? `web ${set.webEntryId}`,
    liquidName: set.liquidName,
    orientation: set.orientation,
    measurement: set.measurement,
    runCount: runs.length,
    createdBy: refOf(users, set.createdBy),
    createdAt: iso(set.createdAt),
    proposals: set.proposals,
  };
}

export async function listSets(ctx: LabContext, filter: { webId?: number }): Promise<LabSetSummary[]> {
  const sets = await ctx.models.LabSet.findAll({
    where: filter.webId !== undefined ? { webEntryId: filter.webId } : {},
    include: [{ model: ctx.models.LabRun, as: 'runs', attributes: ['id', 'web'] }],
    order: [['updatedAt', 'DESC'], ['id', 'DESC']],
  });
  const users = await userRefs(ctx.sequelize, sets.map((s) => s.createdBy));
  return sets.map((s) => setSummaryOf(s, s.runs ?? [], users));
}

async function setDetailOf(ctx: LabContext, set: LabSet, user: SessionUser, t?: Transaction): Promise<LabSetDetail & { analyses: Map<number, RunAnalysis> }> {
  const runs = await ctx.models.LabRun.findAll({ where: { setId: set.id }, order: [['id', 'ASC']], transaction: t });
  const users = await userRefs(ctx.sequelize, [set.createdBy, ...runs.map((r) => r.createdBy)], t);
  const analyses = new Map(runs.map((r) => [r.id, analyseLabRun(runData(r))]));
  const { figures, warnings } = replicateFigures(
    runs.map((r) => ({ id: r.id, name: r.name, analysis: analyses.get(r.id)! })),
    set.measurement,
  );
  const canEdit = rolesAllow(user.roles, 'labdata:edit');
  return {
    ...setSummaryOf(set, runs, users),
    runs: runs.map((r) => summaryOf(r, set, users)),
    figures,
    warnings,
    actions: { edit: canEdit, propose: canEdit && runs.length > 0 },
    analyses,
  };
}

export async function getSet(ctx: LabContext, id: number, user: SessionUser): Promise<LabSetDetail> {
  const { analyses: _a, ...detail } = await setDetailOf(ctx, await loadSet(ctx, id), user);
  return detail;
}

export async function updateSet(ctx: LabContext, id: number, update: LabSetUpdate, user: SessionUser): Promise<LabSetDetail> {
  await ctx.sequelize.transaction(async (t) => {
    const set = await loadSet(ctx, id, t, true);
    if (set.version !== update.version) {
      const { analyses: _a, ...current } = await setDetailOf(ctx, set, user, t);
      throw conflict('set', update.version, set.version, current);
    }
    const name = update.name.trim();
    if (name !== set.name && (await ctx.models.LabSet.findOne({ where: { name }, transaction: t }))) {
      throw new AppError(409, 'name-taken', `A lab set named "${name}" exists already.`);
    }
    set.set({ name, notes: update.notes, version: set.version + 1, updatedBy: user.id });
    await set.save({ transaction: t });
    await audit(t, { actorId: user.id, action: 'update', entityType: 'lab-set', entityId: id, details: { name } });
  });
  return getSet(ctx, id, user);
}

// ——— contact angle by the reference-liquid method ———

/**
 * Contact angle of the test set's liquid from Washburn slopes of both sets (same web, same quantity). Liquid
 * properties are averaged over each set's runs (they differ only by temperature; a spread over 1 K is flagged).
 */
export async function contactAngle(ctx: LabContext, referenceSetId: number, testSetId: number): Promise<ContactAngleAnalysis> {
  if (referenceSetId === testSetId) throw invalid('test', 'different', 'Choose two different sets: one with the reference liquid, one with the test liquid.');
  const ref = await loadSet(ctx, referenceSetId);
  const test = await loadSet(ctx, testSetId);
  if (ref.webEntryId !== test.webEntryId) {
    throw new AppError(422, 'different-webs', `The sets "${ref.name}" and "${test.name}" are of different webs: the method needs both liquids on the same material, packed alike.`);
  }
  if (ref.measurement !== test.measurement) {
    throw new AppError(422, 'different-quantities', `Set "${ref.name}" has ${ref.measurement}s and set "${test.name}" ${test.measurement}s: both must measure the same quantity.`);
  }
  const warnings: ModelWarning[] = [];
  const side = async (set: LabSet) => {
    const runs = await ctx.models.LabRun.findAll({ where: { setId: set.id }, order: [['id', 'ASC']] });
    const runIds: number[] = [];
    const slopes: number[] = [];
    for (const r of runs) {
      try {
        slopes.push(labRunWashburnFit(runData(r)).slope);
        runIds.push(r.id);
      } catch (e) {
        if (!isDomainError(e)) throw e;
        warnings.push({ code: 'run-skipped', message: `Run "${r.name}" was left out: ${e.message}` });
      }
    }
    if (slopes.length === 0) throw new AppError(422, 'insufficient-data', `Set "${set.name}" has no run with a Washburn slope.`);
    const mean = (pick: (l: RunLiquid) => number) => runs.reduce((s, r) => s + pick(r.liquid), 0) / runs.length;
    const temps = runs.map((r) => r.temperature);
    if (Math.max(...temps) - Math.min(...temps) > 1) {
      warnings.push({ code: 'temperature-spread', message: `The runs of "${set.name}" span more than 1 K; the liquid data are averaged over them.` });
    }
    return {
      set,
      runIds,
      slopes,
      liquid: { surfaceTension: mean((l) => l.surfaceTension), viscosity: mean((l) => l.viscosity), density: mean((l) => l.density) },
    };
  };
  const r = await side(ref);
  const s = await side(test);
  if (r.liquid.surfaceTension > 0.03) {
    warnings.push({
      code: 'reference-not-wetting',
      message: `The reference liquid "${ref.liquidName}" has a surface tension of ${formatQuantity(r.liquid.surfaceTension, 'mN/m', 3)}; the method assumes it wets completely, which a low-surface-tension alkane such as n-hexane (about 18 mN/m) does.`,
    });
  }
  const { inputs: _i, ...result } = referenceLiquidContactAngle({
    quantity: ref.measurement,
    reference: { ...r.liquid, slopes: r.slopes },
    test: { ...s.liquid, slopes: s.slopes },
  });
  return {
    reference: { set: { id: ref.id, name: ref.name }, liquidName: ref.liquidName, runIds: r.runIds, slopes: r.slopes },
    test: { set: { id: test.id, name: test.name }, liquidName: test.liquidName, runIds: s.runIds, slopes: s.slopes },
    quantity: ref.measurement,
    result: toPlain(result),
    caution: REFERENCE_LIQUID_CAUTION,
    warnings,
  };
}

// ——— prediction versus measurement ———

interface VariantRow {
  readonly id: number;
  readonly name: string;
  readonly configuration: VariantConfiguration;
  readonly inputs: VariantInputs;
  readonly design_name: string;
  readonly project_name: string;
}

function requireDesignsRead(user: SessionUser): void {
  if (!rolesAllow(user.roles, 'designs:read')) {
    throw new AppError(403, 'forbidden', 'Comparing with design variants needs the Engineer or Programme manager role.', { permission: 'designs:read' });
  }
}

function usesLiquid(inputs: VariantInputs, liquid: RunLiquid): boolean {
  if (liquid.source === 'library') return inputs.liquid.pinned?.id === liquid.entryId;
  return inputs.liquid.ref === liquid.builtInId && inputs.liquid.pinned === undefined;
}

function candidateOf(v: VariantRow, run: LabRun): PredictionCandidate {
  const webRevision = v.inputs.structure?.web?.revision ?? 0;
  return {
    variantId: v.id,
    variantName: v.name,
    designName: v.design_name,
    projectName: v.project_name,
    configuration: v.configuration,
    webRevision,
    matches: { configuration: v.configuration === ORIENTATION_CONFIGURATION[run.orientation], webRevision: webRevision === run.webRevision },
  };
}

async function variantsForWeb(ctx: LabContext, webId: number, variantId?: number): Promise<VariantRow[]> {
  return ctx.sequelize.query<VariantRow>(
    `SELECT v.id, v.name, v.configuration, v.inputs, d.name AS design_name, p.name AS project_name
       FROM variants v JOIN designs d ON d.id = v.design_id JOIN projects p ON p.id = d.project_id
      WHERE (v.inputs #>> '{structure,web,id}') = :webId ${variantId !== undefined ? 'AND v.id = :variantId' : ''}
      ORDER BY p.name, d.name, v.name`,
    { replacements: { webId: String(webId), variantId: variantId ?? null }, type: QueryTypes.SELECT },
  );
}

/** Saved variants that use the run's web and liquid (the configuration and web revision are flagged, not required). */
export async function predictionCandidates(ctx: LabContext, runId: number, user: SessionUser): Promise<PredictionCandidate[]> {
  // The run first: people who may read lab data learn nothing from a 404, and the matrix of declared access holds.
  const run = await loadRun(ctx, runId);
  requireDesignsRead(user);
  return (await variantsForWeb(ctx, run.webEntryId)).filter((v) => usesLiquid(v.inputs, run.liquid)).map((v) => candidateOf(v, run));
}

/**
 * The variant re-evaluated by wick-core over the run's duration (without its tolerance bands) against the run:
 * RMSE, bias, largest deviation and time-to-height errors at `heights` (default ¼, ½ and ¾ of the way from the
 * first to the highest reading).
 */
export async function comparePrediction(ctx: LabContext, runId: number, variantId: number, heights: readonly number[] | undefined, user: SessionUser): Promise<PredictionComparison> {
  const run = await loadRun(ctx, runId);
  requireDesignsRead(user);
  const v = (await variantsForWeb(ctx, run.webEntryId, variantId))[0];
  if (!v || !usesLiquid(v.inputs, run.liquid)) {
    throw new AppError(404, 'not-found', `Variant ${variantId} does not use the web and liquid of run "${run.name}".`);
  }
  const candidate = candidateOf(v, run);
  const warnings: ModelWarning[] = [];
  if (!candidate.matches.configuration) {
    warnings.push({
      code: 'configuration-differs',
      message: `The variant models a ${v.configuration.replace('-', ' ')}; the run was ${run.orientation}: the comparison mixes set-ups.`,
    });
  }
  if (!candidate.matches.webRevision) {
    warnings.push({ code: 'web-revision-differs', message: `The variant uses revision ${candidate.webRevision} of the web; the run's specimen is from revision ${run.webRevision}.` });
  }
  if (Math.abs(v.inputs.liquid.temperature - run.temperature) > 2) {
    warnings.push({
      code: 'temperature-differs',
      message: `The variant's liquid is at ${formatQuantity(v.inputs.liquid.temperature, 'degC', 3)}, the run at ${formatQuantity(run.temperature, 'degC', 3)}.`,
    });
  }
  const duration = run.times[run.times.length - 1];
  const { tolerances: _t, ...rest } = v.inputs;
  const results = evaluateVariant({ ...rest, dimensions: { ...v.inputs.dimensions, duration } }, { curvePoints: 400, samples: 10, seed: 1 });
  if (results.status !== 'ok') {
    throw new AppError(422, 'no-prediction', `The variant predicts no spontaneous uptake (capillary pressure ${formatQuantity(results.capillaryPressure.value, 'Pa', 3)}): there is no curve to compare.`);
  }
  const predictedValues = run.measurement === 'height' ? results.curves.height : results.curves.mass;
  if (!predictedValues) {
    throw new AppError(422, 'no-prediction', 'The variant has no strip width, so it predicts no mass uptake to compare with this mass run.');
  }
  for (const w of results.warnings) warnings.push(w);
  // Default targets lie between the first and the highest reading: below the first one the measured crossing
  // time is unknown (the record starts there).
  const first = run.readings[0];
  const top = Math.max(...run.readings);
  const targets = heights && heights.length ? [...heights] : [0.25, 0.5, 0.75].map((f) => first + f * (top - first));
  const { inputs: _i, ...metrics } = predictionError({
    measured: { time: run.times, values: run.readings },
    predicted: { time: results.curves.time, values: predictedValues },
    heights: targets,
  });
  return {
    candidate,
    quantity: run.measurement,
    measured: { time: run.times, values: run.readings },
    predicted: { time: [...results.curves.time], values: [...predictedValues] },
    metrics: toPlain(metrics),
    warnings: [...warnings, ...metrics.warnings],
  };
}

// ——— proposing fitted values to the library ———

const fmt = (si: number, unit: string) => formatQuantity(si, unit, 3);

/**
 * Writes the set's fitted values into a new revision of its web — the in-plane permeability (mean of the runs
 * that are not outliers, standard uncertainty of that mean) and each run's curve with its file — with a note that
 * names the runs and links to the set, then submits it for review unless asked not to. The web's revision in
 * force must be approved with nothing open on top of it. The revision and the proposal record commit together.
 */
export async function proposeToLibrary(ctx: LabContext, setId: number, request: ProposeRequest, user: SessionUser): Promise<LabSetDetail> {
  const { Entry, Revision } = ctx.library.models;
  const withPermeability = request.permeability ?? true;
  const withCurves = request.curves ?? true;
  const proposal = await ctx.sequelize.transaction(async (t) => {
    const set = await loadSet(ctx, setId, t, true);
    const detail = await setDetailOf(ctx, set, user, t);
    if (detail.runs.length === 0) throw new AppError(422, 'insufficient-data', `Set "${set.name}" has no runs to propose.`);
    const entry = await Entry.findOne({ where: { id: set.webEntryId, kind: 'web' }, transaction: t, lock: t.LOCK.UPDATE });
    if (!entry || entry.headRevisionId === null) throw new AppError(404, 'not-found', `The web of set "${set.name}" is no longer in the library.`);
    const head = await Revision.findByPk(entry.headRevisionId, { transaction: t });
    if (head && head.state !== 'approved') {
      throw new AppError(
        409,
        'open-revision',
        `Revision ${head.number} of the web "${head.name}" is ${head.state.replace('-', ' ')}: a proposal starts a new revision on top of the approved one, so that revision must be approved, returned and finished, or deleted first.`,
        { state: head.state, revision: head.number },
      );
    }
    const runs = await ctx.models.LabRun.findAll({ where: { setId }, order: [['id', 'ASC']], transaction: t });
    const fig = (key: string) => detail.figures.find((f) => f.key === key);
    const figures: Record<string, number> = {};
    const lines: string[] = [];
    for (const f of detail.figures) {
      const s = f.statistics.withoutOutliers;
      figures[f.key] = s.mean;
      const spread = s.n > 1 ? ` ± ${fmt(s.sd, f.unit)} (sd, n = ${s.n})` : ' (one run)';
      lines.push(`${f.label}: ${fmt(s.mean, f.unit)}${spread}${f.outlierRunIds.length ? `, outlier runs left out: ${f.outlierRunIds.map((id) => `#${id}`).join(', ')}` : ''}`);
    }
    const link = ctx.publicUrl + setPath(set.id);
    const runList = runs.map((r) => `#${r.id} "${r.name}"`).join(', ');
    const k = fig('permeability');
    const permeability =
      withPermeability && k
        ? {
            mode: 'measured' as const,
            value: {
              si: k.statistics.withoutOutliers.mean,
              unit: 'um^2',
              source: 'measured' as const,
              ...(k.statistics.withoutOutliers.n > 1 ? { uncertainty: k.statistics.withoutOutliers.sd / Math.sqrt(k.statistics.withoutOutliers.n) } : {}),
              note: `Gravity-restrained Washburn fit, ${set.orientation} wicking with ${set.liquidName}, lab set "${set.name}": ${link}`.slice(0, 500),
            },
          }
        : undefined;
    const curves: LabCurve[] = [];
    if (withCurves) {
      for (const r of runs) {
        curves.push({
          key: `lab-run-${r.id}`,
          name: `Lab run #${r.id}: ${r.name}`.slice(0, 200),
          measurement: r.measurement,
          liquid: r.liquid.name,
          timeUnit: r.timeUnit,
          valueUnit: r.valueUnit,
          times: r.times,
          values: r.readings,
          file: await fileRefOf(ctx, r.fileId, t),
        });
      }
    }
    if (!permeability && curves.length === 0) {
      throw new AppError(422, 'nothing-to-propose', 'Nothing to propose: the fits give no permeability (it needs vertical or inclined heights, a web porosity and visible gravity slowing), and curves were not chosen.');
    }
    // patchEntryData answers 409 with the current entry when the engineer's view of the web is stale.
    await patchEntryData(
      ctx.library,
      'web',
      entry.id,
      request.webVersion,
      user,
      (data) => {
        const web = data as WebData;
        const keys = new Set(curves.map((c) => c.key));
        const next: WebData = {
          ...web,
          ...(permeability ? { permeabilityInPlane: permeability } : {}),
          curves: [...web.curves.filter((c) => !keys.has(c.key)), ...curves],
        };
        // The library's own rules (ranges, at most 50 curves …), so the new revision stays editable there.
        const checked = webDataSchema.safeParse(next);
        if (!checked.success) {
          const issues = fieldIssues(checked.error).map((i) => ({ ...i, field: `web.${i.field}` }));
          throw new AppError(422, 'proposal-invalid', `The web would not pass the library's checks: ${issues[0].field} — ${issues[0].message}. Nothing was proposed.`, { issues });
        }
        return next;
      },
      t,
    );
    await entry.reload({ transaction: t });
    const created = await Revision.findByPk(entry.headRevisionId!, { transaction: t });
    const note =
      `Fitted values proposed from lab set "${set.name}" (${set.orientation}, ${set.liquidName}; runs ${runList}) by ${(await userRefs(ctx.sequelize, [user.id], t)).get(user.id)?.name ?? 'an engineer'}:\n` +
      lines.map((l) => `- ${l}`).join('\n') +
      `\nRuns and fits: ${link}\nEngineering estimates from idealised models; confirm with the standard test methods and qualified review.`;
    // Library notes hold at most 5000 characters: the proposal comes first, older notes are shortened.
    created!.set({ notes: (created!.notes ? `${note}\n\n${created!.notes}` : note).slice(0, 5000) });
    await created!.save({ transaction: t });
    const record: LabProposal = {
      entryId: entry.id,
      revision: created!.number,
      webName: created!.name,
      submitted: false,
      proposedBy: { id: user.id, name: (await userRefs(ctx.sequelize, [user.id], t)).get(user.id)?.name ?? '(unknown)' },
      proposedAt: new Date().toISOString(),
      runIds: runs.map((r) => r.id),
      figures: permeability ? { ...figures, permeabilityWritten: permeability.value.si } : figures,
    };
    set.set({ proposals: [...set.proposals, record], version: set.version + 1, updatedBy: user.id });
    await set.save({ transaction: t });
    await audit(t, {
      actorId: user.id,
      action: 'create',
      entityType: 'lab-proposal',
      entityId: set.id,
      details: { setName: set.name, webId: entry.id, revision: created!.number, runIds: record.runIds, figures: record.figures },
    });
    return { record, entryVersion: entry.version };
  });
  if (request.submit ?? true) {
    await submitEntry(ctx.library, 'web', proposal.record.entryId, proposal.entryVersion, user);
    await ctx.sequelize.transaction(async (t) => {
      const set = await loadSet(ctx, setId, t, true);
      set.set({
        proposals: set.proposals.map((p) => (p.entryId === proposal.record.entryId && p.revision === proposal.record.revision ? { ...p, submitted: true } : p)),
      });
      await set.save({ transaction: t });
    });
  }
  return getSet(ctx, setId, user);
}

/**
 * Projects, designs and variants. A variant is saved with its inputs checked by wick-core, evaluated on the
 * server with the same wick-core code the browser runs (the server's snapshot is the record), the wick-core
 * version, and the library revisions it pins. Reads add what the library says about those revisions now:
 * whether they are approved and whether a newer approved revision exists.
 */
import { Op, UniqueConstraintError, type Sequelize, type Transaction } from 'sequelize';
import {
  anyKeyFigures,
  evaluateAnyVariant,
  isStackInputs,
  isStackResults,
  liquidFromLibrary,
  pinnedMaterials,
  readAnyVariantInputs,
  stackLayerFromLibrary,
  structureFromLibrary,
  WICK_CORE_VERSION,
  type DecisionRecord,
  type DesignSummary,
  type DesignWrite,
  type FibreData,
  type LibraryFibre,
  type LiquidData,
  type WebData,
  type MaterialStatus,
  type PersonRef,
  type PinnedMaterial,
  type ProjectDetail,
  type ProjectSummary,
  type ProjectWrite,
  type RerunRequest,
  type AnyVariantInputs,
  type StackVariantInputs,
  type VariantDetail,
  type VariantInputs,
  type VariantSummary,
  type VariantWrite,
} from 'wick-core';
import type { SessionUser } from '../auth/authorize';
import { AppError } from '../errors';
import { designModels, type Decision, type Design, type DesignModels, type Project, type Variant } from '../models';
import { libraryModels } from '../models/library';
import { audit } from './audit';

export interface DesignsContext {
  readonly sequelize: Sequelize;
  readonly models: DesignModels;
}

export function designsContext(sequelize: Sequelize): DesignsContext {
  return { sequelize, models: designModels(sequelize) };
}

const notFound = (what: string, id: number) => new AppError(404, 'not-found', `There is no ${what} ${id}.`);

function conflictOnName<T>(what: string, name: string): (e: unknown) => T {
  return (e) => {
    if (e instanceof UniqueConstraintError) throw new AppError(409, 'name-taken', `A ${what} named "${name}" already exists here.`);
    throw e;
  };
}

// ── library lookups ───────────────────────────────────────────────────────────────────────────────────────────

/** The library revisions a variant's inputs pin (the web of the layer or of each stack layer, the liquid). */
export function pinnedOf(inputs: AnyVariantInputs): PinnedMaterial[] {
  return pinnedMaterials(inputs);
}

/** What the library says now about each pinned revision (one query per table for any number of variants). */
export async function materialStatuses(
  sequelize: Sequelize,
  pinned: readonly PinnedMaterial[],
  tx?: Transaction,
): Promise<Map<string, MaterialStatus>> {
  const key = (p: Pick<PinnedMaterial, 'id' | 'revision'>) => `${p.id}#${p.revision}`;
  const out = new Map<string, MaterialStatus>();
  if (pinned.length === 0) return out;
  const { Entry, Revision } = libraryModels(sequelize);
  const entryIds = [...new Set(pinned.map((p) => p.id))];
  const [entries, revisions] = await Promise.all([
    Entry.findAll({ where: { id: entryIds }, transaction: tx }),
    Revision.findAll({ where: { entryId: entryIds }, attributes: ['id', 'entryId', 'number', 'state', 'name'], transaction: tx }),
  ]);
  for (const p of pinned) {
    const entry = entries.find((e) => e.id === p.id && e.kind === p.kind);
    const rev = revisions.find((r) => r.entryId === p.id && r.number === p.revision);
    const approvedNumber = entry?.approvedRevisionId ? revisions.find((r) => r.id === entry.approvedRevisionId)?.number ?? null : null;
    out.set(key(p), {
      ...p,
      name: rev?.name ?? p.name,
      state: rev?.state ?? p.state,
      approved: rev?.state === 'approved',
      newerApprovedRevision: approvedNumber !== null && approvedNumber > p.revision ? approvedNumber : null,
      found: entry !== undefined && rev !== undefined,
    });
  }
  return out;
}

function statusesFor(inputs: AnyVariantInputs, all: Map<string, MaterialStatus>): MaterialStatus[] {
  return pinnedOf(inputs).map(
    (p) => all.get(`${p.id}#${p.revision}`) ?? { ...p, approved: false, newerApprovedRevision: null, found: false },
  );
}

/**
 * Checks inputs with wick-core, then replaces each pin's state and name with the library's (the client's copy is
 * not trusted). A pin to a revision that does not exist is refused.
 */
async function checkedInputs(sequelize: Sequelize, raw: unknown, tx: Transaction): Promise<AnyVariantInputs> {
  const inputs = readAnyVariantInputs(raw);
  const pins = pinnedOf(inputs);
  if (pins.length === 0) return inputs;
  const statuses = await materialStatuses(sequelize, pins, tx);
  const fix = (p: PinnedMaterial | undefined, field: string): PinnedMaterial | undefined => {
    if (!p) return undefined;
    const s = statuses.get(`${p.id}#${p.revision}`);
    if (!s?.found) {
      throw new AppError(422, 'unknown-material', `The library has no ${p.kind} ${p.id} revision ${p.revision}.`, { field });
    }
    return { kind: p.kind, id: p.id, revision: p.revision, name: s.name, state: s.state };
  };
  const liquidPin = fix(inputs.liquid.pinned, 'liquid.pinned');
  if (isStackInputs(inputs)) {
    return {
      ...inputs,
      layers: inputs.layers.map((l, j) => {
        const web = fix(l.structure.web, `layers[${j}].structure.web`);
        return web ? { ...l, structure: { ...l.structure, web } } : l;
      }),
      liquid: { ...inputs.liquid, ...(liquidPin ? { pinned: liquidPin } : {}) },
    };
  }
  const web = fix(inputs.structure?.web, 'structure.web');
  return {
    ...inputs,
    ...(inputs.structure ? { structure: { ...inputs.structure, ...(web ? { web } : {}) } } : {}),
    liquid: { ...inputs.liquid, ...(liquidPin ? { pinned: liquidPin } : {}) },
  };
}

// ── people ────────────────────────────────────────────────────────────────────────────────────────────────────

async function people(ctx: DesignsContext, ids: readonly number[]): Promise<Map<number, PersonRef>> {
  const unique = [...new Set(ids)];
  const rows = unique.length ? await ctx.models.User.findAll({ where: { id: unique }, attributes: ['id', 'name'] }) : [];
  return new Map(rows.map((u) => [u.id, { id: u.id, name: u.name }]));
}

const person = (map: Map<number, PersonRef>, id: number): PersonRef => map.get(id) ?? { id, name: '(unknown)' };

// ── variants ──────────────────────────────────────────────────────────────────────────────────────────────────

/**
 * Headline figures for lists: equilibrium height, the last reading, capacity per mass; for a stack the last
 * gush's acquisition time (the one that tells constructions apart; "not reached" when it is), the rewet
 * indicator and the capacity used.
 */
function headline(v: Variant) {
  const r = v.results;
  const figs = anyKeyFigures(r);
  if (isStackResults(r)) {
    const wanted = new Set([`acquisition@${Math.max(1, r.insults.length)}`, 'rewetIndicator', 'capacityUsed']);
    return figs.filter((f) => wanted.has(f.key) && (f.value !== null || f.nullMeans !== undefined));
  }
  const last = r.status === 'ok' ? r.atTimes[r.atTimes.length - 1] : undefined;
  const wanted = new Set(['equilibriumHeight', 'capacityPerMass', ...(last ? [`height@${last.time}`] : [])]);
  return figs.filter((f) => wanted.has(f.key) && f.value !== null);
}

function summaryOf(v: Variant, statuses: Map<string, MaterialStatus>, names: Map<number, PersonRef>): VariantSummary {
  const materials = statusesFor(v.inputs, statuses);
  return {
    id: v.id,
    designId: v.designId,
    name: v.name,
    // The wire type lists the single-layer configurations; 'stack' joins it when VariantSummary is widened.
    configuration: v.configuration as VariantSummary['configuration'],
    status: v.results.status,
    coreVersion: v.coreVersion,
    usesUnapproved: materials.some((m) => !m.approved),
    hasNewerMaterials: materials.some((m) => m.newerApprovedRevision !== null),
    materials,
    headline: headline(v),
    updatedAt: v.updatedAt.toISOString(),
    updatedBy: person(names, v.updatedBy),
  };
}

async function detailOf(ctx: DesignsContext, v: Variant): Promise<VariantDetail> {
  const design = await ctx.models.Design.findByPk(v.designId, { include: [{ model: ctx.models.Project, as: 'project' }] });
  const statuses = await materialStatuses(ctx.sequelize, pinnedOf(v.inputs));
  const names = await people(ctx, [v.createdBy, v.updatedBy]);
  const materials = statusesFor(v.inputs, statuses);
  return {
    id: v.id,
    designId: v.designId,
    designName: design?.name ?? '',
    projectId: design?.projectId ?? 0,
    projectName: design?.project?.name ?? '',
    name: v.name,
    notes: v.notes,
    // A stack variant's inputs, options and results pass as they are (StackVariantInputs …); VariantDetail
    // still names the single-layer types until the stack joins its union.
    inputs: v.inputs as VariantInputs,
    options: v.options as VariantDetail['options'],
    results: v.results as VariantDetail['results'],
    coreVersion: v.coreVersion,
    currentCoreVersion: WICK_CORE_VERSION,
    materials,
    usesUnapproved: materials.some((m) => !m.approved),
    hasNewerMaterials: materials.some((m) => m.newerApprovedRevision !== null),
    version: v.version,
    createdAt: v.createdAt.toISOString(),
    updatedAt: v.updatedAt.toISOString(),
    createdBy: person(names, v.createdBy),
    updatedBy: person(names, v.updatedBy),
  };
}

export async function findVariant(ctx: DesignsContext, id: number, tx?: Transaction): Promise<Variant> {
  const v = await ctx.models.Variant.findByPk(id, { transaction: tx, ...(tx ? { lock: tx.LOCK.UPDATE } : {}) });
  if (!v) throw notFound('variant', id);
  return v;
}

export async function getVariant(ctx: DesignsContext, id: number): Promise<VariantDetail> {
  return detailOf(ctx, await findVariant(ctx, id));
}

/** Evaluates inputs exactly as the browser does (same wick-core, same options; a stack as its Web Worker does). */
function evaluate(inputs: AnyVariantInputs) {
  return { ...evaluateAnyVariant(inputs), coreVersion: WICK_CORE_VERSION };
}

export async function createVariant(ctx: DesignsContext, designId: number, write: VariantWrite, user: SessionUser): Promise<VariantDetail> {
  const created = await ctx.sequelize.transaction(async (tx) => {
    const design = await ctx.models.Design.findByPk(designId, { transaction: tx });
    if (!design) throw notFound('design', designId);
    const inputs = await checkedInputs(ctx.sequelize, write.inputs, tx);
    const v = await ctx.models.Variant.create(
      {
        designId,
        name: write.name,
        notes: write.notes ?? '',
        configuration: inputs.configuration,
        inputs,
        ...evaluate(inputs),
        materials: pinnedOf(inputs),
        createdBy: user.id,
        updatedBy: user.id,
      },
      { transaction: tx },
    ).catch(conflictOnName<Variant>('variant', write.name));
    await audit(tx, {
      actorId: user.id,
      action: 'create',
      entityType: 'variant',
      entityId: v.id,
      details: { name: v.name, designId, configuration: inputs.configuration, coreVersion: WICK_CORE_VERSION },
    });
    return v;
  });
  return detailOf(ctx, created);
}

function checkVersion(v: Variant, version: number | undefined): void {
  if (version === undefined) throw new AppError(422, 'version-required', 'Send the version you read, so a newer save is not overwritten.');
  if (version !== v.version) {
    throw new AppError(409, 'stale', `Someone saved this variant since you opened it (version ${v.version}, yours ${version}). Reload it.`, {
      currentVersion: v.version,
    });
  }
}

export async function updateVariant(ctx: DesignsContext, id: number, write: VariantWrite, user: SessionUser): Promise<VariantDetail> {
  const updated = await ctx.sequelize.transaction(async (tx) => {
    const v = await findVariant(ctx, id, tx);
    checkVersion(v, write.version);
    const inputs = await checkedInputs(ctx.sequelize, write.inputs, tx);
    await v
      .update(
        {
          name: write.name,
          notes: write.notes ?? v.notes,
          configuration: inputs.configuration,
          inputs,
          ...evaluate(inputs),
          materials: pinnedOf(inputs),
          version: v.version + 1,
          updatedBy: user.id,
        },
        { transaction: tx },
      )
      .catch(conflictOnName<Variant>('variant', write.name));
    await audit(tx, { actorId: user.id, action: 'update', entityType: 'variant', entityId: v.id, details: { name: v.name, version: v.version } });
    return v;
  });
  return detailOf(ctx, updated);
}

/**
 * Recomputes a saved variant with the running wick-core; with `repin`, first moves every pin that has a newer
 * approved revision to it, taking that revision's values (a web's structure, a liquid's definition).
 */
export async function rerunVariant(ctx: DesignsContext, id: number, req: RerunRequest, user: SessionUser): Promise<VariantDetail> {
  const updated = await ctx.sequelize.transaction(async (tx) => {
    const v = await findVariant(ctx, id, tx);
    checkVersion(v, req.version);
    const raw = req.repin ? await repinToLatest(ctx, v.inputs, tx) : v.inputs;
    const inputs = await checkedInputs(ctx.sequelize, raw, tx);
    await v.update(
      { inputs, ...evaluate(inputs), materials: pinnedOf(inputs), version: v.version + 1, updatedBy: user.id },
      { transaction: tx },
    );
    await audit(tx, {
      actorId: user.id,
      action: 'update',
      entityType: 'variant',
      entityId: v.id,
      details: { name: v.name, rerun: true, repin: req.repin, coreVersion: WICK_CORE_VERSION },
    });
    return v;
  });
  return detailOf(ctx, updated);
}

/** The newest approved revision of a library entry, or null. */
async function approvedRevision(ctx: DesignsContext, entryId: number, tx: Transaction) {
  const { Entry, Revision } = libraryModels(ctx.sequelize);
  const entry = await Entry.findByPk(entryId, { transaction: tx });
  if (!entry?.approvedRevisionId) return null;
  return Revision.findByPk(entry.approvedRevisionId, { transaction: tx });
}

/** A web pin's newest approved revision with its blend's fibres, when it is newer than the pin. */
async function newerWeb(ctx: DesignsContext, webPin: PinnedMaterial, tx: Transaction) {
  const rev = await approvedRevision(ctx, webPin.id, tx);
  if (!rev || rev.number <= webPin.revision) return null;
  const data = rev.data as WebData;
  const fibres: LibraryFibre[] = [];
  for (const part of data.blend) {
    if (part.fibreId === undefined) continue;
    const f = await approvedRevision(ctx, part.fibreId, tx);
    if (f) fibres.push({ id: part.fibreId, name: f.name, data: f.data as FibreData });
  }
  const pinned = { kind: 'web' as const, id: webPin.id, revision: rev.number, name: rev.name, state: rev.state };
  return { web: { ...pinned, data }, fibres };
}

/**
 * Moves the web and liquid pins to their newest approved revisions and takes those revisions' values. What the
 * library does not give (a contact angle for this liquid) and what belongs to the variant (dimensions,
 * checkpoints, tolerances, permeability choice when the web has none; a stack layer's name and retention
 * choice) is kept.
 */
async function repinToLatest(ctx: DesignsContext, inputs: AnyVariantInputs, tx: Transaction): Promise<AnyVariantInputs> {
  let liquid = inputs.liquid;
  const liquidPin = inputs.liquid.pinned;
  if (liquidPin) {
    const rev = await approvedRevision(ctx, liquidPin.id, tx);
    if (rev && rev.number > liquidPin.revision) {
      const pinned = { kind: 'liquid' as const, id: liquidPin.id, revision: rev.number, name: rev.name, state: rev.state };
      liquid = { ...liquid, pinned, ref: liquidFromLibrary({ ...pinned, data: rev.data as LiquidData }) };
    }
  }
  const liquidName = typeof liquid.ref === 'string' ? liquid.ref : liquid.ref.name;
  if (isStackInputs(inputs)) {
    const layers: StackVariantInputs['layers'][number][] = [];
    for (const l of inputs.layers) {
      const newer = l.structure.web ? await newerWeb(ctx, l.structure.web, tx) : null;
      if (!newer) {
        layers.push(l);
        continue;
      }
      const { layer } = stackLayerFromLibrary(newer.web, newer.fibres, liquidName, { name: l.name });
      layers.push({ ...l, structure: { ...layer.structure, contactAngle: layer.structure.contactAngle ?? l.structure.contactAngle } });
    }
    return { ...inputs, liquid, layers };
  }
  let next: VariantInputs = { ...inputs, liquid };
  const newer = inputs.structure?.web ? await newerWeb(ctx, inputs.structure.web, tx) : null;
  if (newer && inputs.structure) {
    const { structure } = structureFromLibrary(newer.web, newer.fibres, liquidName);
    next = {
      ...next,
      structure: {
        ...structure,
        contactAngle: structure.contactAngle ?? inputs.structure.contactAngle,
        capillaryPressureFrom: inputs.structure.capillaryPressureFrom,
      },
    };
  }
  return next;
}

export async function deleteVariant(ctx: DesignsContext, id: number, user: SessionUser): Promise<void> {
  await ctx.sequelize.transaction(async (tx) => {
    const v = await findVariant(ctx, id, tx);
    await v.destroy({ transaction: tx });
    await audit(tx, { actorId: user.id, action: 'delete', entityType: 'variant', entityId: id, details: { name: v.name, designId: v.designId } });
  });
}

// ── designs ───────────────────────────────────────────────────────────────────────────────────────────────────

async function designSummaries(ctx: DesignsContext, designs: Design[]): Promise<DesignSummary[]> {
  const variants = designs.length
    ? await ctx.models.Variant.findAll({ where: { designId: designs.map((d) => d.id) }, order: [['id', 'ASC']] })
    : [];
  const statuses = await materialStatuses(ctx.sequelize, variants.flatMap((v) => pinnedOf(v.inputs)));
  const names = await people(ctx, variants.map((v) => v.updatedBy));
  return designs.map((d) => ({
    id: d.id,
    projectId: d.projectId,
    name: d.name,
    description: d.description,
    variants: variants.filter((v) => v.designId === d.id).map((v) => summaryOf(v, statuses, names)),
  }));
}

export async function getDesign(ctx: DesignsContext, id: number): Promise<DesignSummary & { projectName: string }> {
  const d = await ctx.models.Design.findByPk(id, { include: [{ model: ctx.models.Project, as: 'project' }] });
  if (!d) throw notFound('design', id);
  const [summary] = await designSummaries(ctx, [d]);
  return { ...summary, projectName: d.project?.name ?? '' };
}

export async function createDesign(ctx: DesignsContext, projectId: number, write: DesignWrite, user: SessionUser): Promise<DesignSummary> {
  const d = await ctx.sequelize.transaction(async (tx) => {
    const project = await ctx.models.Project.findByPk(projectId, { transaction: tx });
    if (!project) throw notFound('project', projectId);
    const design = await ctx.models.Design.create(
      { projectId, name: write.name, description: write.description ?? '', createdBy: user.id },
      { transaction: tx },
    ).catch(conflictOnName<Design>('design', write.name));
    await audit(tx, { actorId: user.id, action: 'create', entityType: 'design', entityId: design.id, details: { name: design.name, projectId } });
    return design;
  });
  const [summary] = await designSummaries(ctx, [d]);
  return summary;
}

export async function updateDesign(ctx: DesignsContext, id: number, write: DesignWrite, user: SessionUser): Promise<DesignSummary> {
  const d = await ctx.sequelize.transaction(async (tx) => {
    const design = await ctx.models.Design.findByPk(id, { transaction: tx });
    if (!design) throw notFound('design', id);
    await design
      .update({ name: write.name, description: write.description ?? design.description }, { transaction: tx })
      .catch(conflictOnName<Design>('design', write.name));
    await audit(tx, { actorId: user.id, action: 'update', entityType: 'design', entityId: id, details: { name: design.name } });
    return design;
  });
  const [summary] = await designSummaries(ctx, [d]);
  return summary;
}

export async function deleteDesign(ctx: DesignsContext, id: number, user: SessionUser): Promise<void> {
  await ctx.sequelize.transaction(async (tx) => {
    const design = await ctx.models.Design.findByPk(id, { transaction: tx });
    if (!design) throw notFound('design', id);
    await design.destroy({ transaction: tx });
    await audit(tx, { actorId: user.id, action: 'delete', entityType: 'design', entityId: id, details: { name: design.name } });
  });
}

// ── projects ──────────────────────────────────────────────────────────────────────────────────────────────────

export function decisionRecord(d: Decision, names: Map<number, PersonRef>): DecisionRecord {
  return {
    id: d.id,
    projectId: d.projectId,
    variantIds: d.variantIds,
    baselineVariantId: d.baselineVariantId,
    chosenVariantId: d.chosenVariantId,
    chosenVariantName: d.chosenVariantName,
    rationale: d.rationale,
    decidedBy: person(names, d.decidedBy),
    decidedAt: d.decidedAt.toISOString(),
  };
}

export async function projectDecisions(ctx: DesignsContext, projectId: number): Promise<DecisionRecord[]> {
  const rows = await ctx.models.Decision.findAll({ where: { projectId }, order: [['decidedAt', 'DESC'], ['id', 'DESC']] });
  const names = await people(ctx, rows.map((d) => d.decidedBy));
  return rows.map((d) => decisionRecord(d, names));
}

export async function listProjects(ctx: DesignsContext): Promise<ProjectSummary[]> {
  const projects = await ctx.models.Project.findAll({ order: [['name', 'ASC']] });
  const designs = await ctx.models.Design.findAll({ attributes: ['id', 'projectId'] });
  const variants = designs.length
    ? await ctx.models.Variant.findAll({ attributes: ['id', 'designId', 'updatedAt'], where: { designId: { [Op.in]: designs.map((d) => d.id) } } })
    : [];
  return projects.map((p) => {
    const ds = designs.filter((d) => d.projectId === p.id);
    const vs = variants.filter((v) => ds.some((d) => d.id === v.designId));
    const latest = Math.max(p.updatedAt.getTime(), ...vs.map((v) => v.updatedAt.getTime()));
    return {
      id: p.id,
      name: p.name,
      description: p.description,
      designCount: ds.length,
      variantCount: vs.length,
      updatedAt: new Date(latest).toISOString(),
    };
  });
}

export async function getProject(ctx: DesignsContext, id: number): Promise<ProjectDetail> {
  const p = await ctx.models.Project.findByPk(id);
  if (!p) throw notFound('project', id);
  return projectDetail(ctx, p);
}

async function projectDetail(ctx: DesignsContext, p: Project): Promise<ProjectDetail> {
  const designs = await ctx.models.Design.findAll({ where: { projectId: p.id }, order: [['id', 'ASC']] });
  const summaries = await designSummaries(ctx, designs);
  const decisions = await projectDecisions(ctx, p.id);
  const variantTimes = summaries.flatMap((d) => d.variants.map((v) => Date.parse(v.updatedAt)));
  return {
    id: p.id,
    name: p.name,
    description: p.description,
    designCount: designs.length,
    variantCount: summaries.reduce((s, d) => s + d.variants.length, 0),
    updatedAt: new Date(Math.max(p.updatedAt.getTime(), ...variantTimes)).toISOString(),
    designs: summaries,
    decisions,
  };
}

export async function createProject(ctx: DesignsContext, write: ProjectWrite, user: SessionUser): Promise<ProjectDetail> {
  const p = await ctx.sequelize.transaction(async (tx) => {
    const project = await ctx.models.Project.create(
      { name: write.name, description: write.description ?? '', createdBy: user.id },
      { transaction: tx },
    ).catch(conflictOnName<Project>('project', write.name));
    await audit(tx, { actorId: user.id, action: 'create', entityType: 'project', entityId: project.id, details: { name: project.name } });
    return project;
  });
  return projectDetail(ctx, p);
}

export async function updateProject(ctx: DesignsContext, id: number, write: ProjectWrite, user: SessionUser): Promise<ProjectDetail> {
  const p = await ctx.sequelize.transaction(async (tx) => {
    const project = await ctx.models.Project.findByPk(id, { transaction: tx });
    if (!project) throw notFound('project', id);
    await project
      .update({ name: write.name, description: write.description ?? project.description }, { transaction: tx })
      .catch(conflictOnName<Project>('project', write.name));
    await audit(tx, { actorId: user.id, action: 'update', entityType: 'project', entityId: id, details: { name: project.name } });
    return project;
  });
  return projectDetail(ctx, p);
}

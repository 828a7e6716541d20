/**
 * Side-by-side comparison of 2–8 saved variants (key figures with deltas against a baseline, the best value
 * marked, curves to overlay) and the decision taken on it, written to the audit log in the same transaction.
 */
import {
  anyKeyFigures,
  isStackResults,
  COMPARE_MAX,
  COMPARE_MIN,
  compareKeyFigures,
  type CompareResponse,
  type CompareVariant,
  type DecisionRecord,
  type DecisionWrite,
} from 'wick-core';
import type { SessionUser } from '../auth/authorize';
import { AppError } from '../errors';
import type { Variant } from '../models';
import { audit } from './audit';
import { decisionRecord, materialStatuses, pinnedOf, projectDecisions, type DesignsContext } from './designs';

function checkSelection(ids: readonly number[], baselineId: number | undefined): number {
  const unique = new Set(ids);
  if (unique.size !== ids.length) throw new AppError(422, 'duplicate-variant', 'Each variant may be chosen once.', { field: 'variants' });
  if (ids.length < COMPARE_MIN || ids.length > COMPARE_MAX) {
    throw new AppError(422, 'compare-size', `Compare ${COMPARE_MIN} to ${COMPARE_MAX} variants (got ${ids.length}).`, { field: 'variants' });
  }
  const baseline = baselineId ?? ids[0];
  if (!unique.has(baseline)) throw new AppError(422, 'baseline-not-selected', 'The baseline must be one of the compared variants.', { field: 'baseline' });
  return baseline;
}

/** The variants in the order asked for, each with its design and project. */
async function loadVariants(ctx: DesignsContext, ids: readonly number[]): Promise<Variant[]> {
  const { Variant, Design, Project } = ctx.models;
  const rows = await Variant.findAll({
    where: { id: [...ids] },
    include: [{ model: Design, as: 'design', include: [{ model: Project, as: 'project' }] }],
  });
  const missing = ids.filter((id) => !rows.some((r) => r.id === id));
  if (missing.length) throw new AppError(404, 'not-found', `There is no variant ${missing.join(', ')}.`, { missing });
  return ids.map((id) => rows.find((r) => r.id === id)!);
}

export async function compareVariants(ctx: DesignsContext, ids: readonly number[], baselineId?: number): Promise<CompareResponse> {
  const baseline = checkSelection(ids, baselineId);
  const rows = await loadVariants(ctx, ids);
  const statuses = await materialStatuses(ctx.sequelize, rows.flatMap((v) => pinnedOf(v.inputs)));
  const variants: CompareVariant[] = rows.map((v) => {
    const materials = pinnedOf(v.inputs).map(
      (p) => statuses.get(`${p.id}#${p.revision}`) ?? { ...p, approved: false, newerApprovedRevision: null, found: false },
    );
    const r = v.results;
    return {
      id: v.id,
      name: v.name,
      designName: v.design?.name ?? '',
      projectId: v.design?.projectId ?? 0,
      projectName: v.design?.project?.name ?? '',
      // 'stack' joins the wire type's configurations when CompareVariant is widened.
      configuration: v.configuration as CompareVariant['configuration'],
      status: r.status,
      usesUnapproved: materials.some((m) => !m.approved),
      materials,
      // The overlay plots wetted length against time; a stack has no such curve (its figures compare instead).
      curve: !isStackResults(r) && r.status === 'ok' ? { time: r.curves.time, height: r.curves.height } : null,
      uptake: isStackResults(r) ? { time: r.curves.time, absorbed: r.curves.absorbed, surfaceLiquid: r.curves.surfaceLiquid } : null,
    };
  });
  const figures = compareKeyFigures(
    rows.map((v) => ({ id: v.id, results: v.results })),
    baseline,
    anyKeyFigures,
  );
  const projectIds = [...new Set(variants.map((v) => v.projectId))];
  const decisions = projectIds.length === 1 ? await projectDecisions(ctx, projectIds[0]) : [];
  return { baselineId: baseline, variants, figures, decisions };
}

/**
 * Records the decision on a comparison: the chosen variant (one of the compared ones, all in one project), the
 * rationale, who and when, with the key-figure table as it stood. The audit row commits with it.
 */
export async function recordDecision(ctx: DesignsContext, write: DecisionWrite, user: SessionUser): Promise<DecisionRecord> {
  const baseline = checkSelection(write.variantIds, write.baselineVariantId);
  if (!write.variantIds.includes(write.chosenVariantId)) {
    throw new AppError(422, 'chosen-not-compared', 'The chosen variant must be one of the compared variants.', { field: 'chosenVariantId' });
  }
  const comparison = await compareVariants(ctx, write.variantIds, baseline);
  const projects = new Set(comparison.variants.map((v) => v.projectId));
  if (projects.size !== 1) {
    throw new AppError(422, 'mixed-projects', 'A decision belongs to one project: compare variants of the same project.', { field: 'variantIds' });
  }
  const chosen = comparison.variants.find((v) => v.id === write.chosenVariantId)!;
  const names = new Map([[user.id, { id: user.id, name: '' }]]);
  const row = await ctx.sequelize.transaction(async (tx) => {
    const d = await ctx.models.Decision.create(
      {
        projectId: chosen.projectId,
        variantIds: [...write.variantIds],
        baselineVariantId: baseline,
        chosenVariantId: chosen.id,
        chosenVariantName: chosen.name,
        rationale: write.rationale,
        snapshot: { figures: comparison.figures, variants: comparison.variants.map((v) => ({ id: v.id, name: v.name })) },
        decidedBy: user.id,
      },
      { transaction: tx },
    );
    await audit(tx, {
      actorId: user.id,
      action: 'create',
      entityType: 'decision',
      entityId: d.id,
      details: {
        projectId: chosen.projectId,
        chosenVariantId: chosen.id,
        chosenVariantName: chosen.name,
        variantIds: write.variantIds,
        baselineVariantId: baseline,
        rationale: write.rationale,
        usesUnapproved: chosen.usesUnapproved,
      },
    });
    return d;
  });
  const person = await ctx.models.User.findByPk(user.id, { attributes: ['id', 'name'] });
  if (person) names.set(user.id, { id: person.id, name: person.name });
  return decisionRecord(row, names);
}

/**
 * A variant's inputs as rows of label, SI value, unit and source — the input table of CSV exports and
 * reports, so "where does this number come from" has one answer everywhere.
 */
import { SI_UNIT } from '../units/dimensions';
import { TOLERANCE_FIELDS, VARIANT_FIELDS } from './fields';
import { CONFIGURATION_LABELS, type PinnedMaterial, type VariantInputs, type VariantResults } from './variant';

export interface VariantInputRow {
  readonly path: string;
  readonly label: string;
  /** SI number, or text for choices and lists. */
  readonly value: number | string;
  /** SI unit ('' for text). */
  readonly unit: string;
  readonly source: string;
}

function pinnedLabel(p: PinnedMaterial): string {
  return `${p.name} (library ${p.kind} #${p.id}, revision ${p.revision}${p.state === 'approved' ? '' : `, ${p.state} — not approved`})`;
}

function get(o: unknown, path: string): unknown {
  return path.split('.').reduce<unknown>((x, k) => (x && typeof x === 'object' ? (x as Record<string, unknown>)[k] : undefined), o);
}

/** Input rows of a variant; `results` adds the liquid property values and their sources. */
export function describeInputs(inputs: VariantInputs, results?: VariantResults): VariantInputRow[] {
  const rows: VariantInputRow[] = [];
  rows.push({ path: 'configuration', label: 'Configuration', value: CONFIGURATION_LABELS[inputs.configuration], unit: '', source: '' });
  const web = inputs.structure?.web;
  const fieldSource = (path: string): string => {
    const key = path.split('.').slice(1).join('.');
    const own = inputs.structure?.sources?.[key];
    if (own) return own;
    if (path.startsWith('structure.') && web) return pinnedLabel(web);
    return 'entered for this variant';
  };
  if (web) rows.push({ path: 'structure.web', label: 'Web', value: pinnedLabel(web), unit: '', source: 'material library' });

  for (const f of VARIANT_FIELDS) {
    const v = get(inputs, f.path);
    if (v === undefined || v === null) continue;
    const unit = SI_UNIT[f.dimension];
    if (Array.isArray(v)) {
      rows.push({ path: f.path, label: f.label, value: v.join('; '), unit, source: 'entered for this variant' });
    } else if (typeof v === 'number') {
      rows.push({ path: f.path, label: f.label, value: v, unit, source: fieldSource(f.path) });
    }
  }
  const perm = inputs.structure?.permeability;
  if (perm?.mode === 'correlation') {
    rows.push({ path: 'structure.permeability.correlation', label: 'Permeability correlation', value: perm.correlation, unit: '', source: 'chosen for this variant' });
  }
  if (inputs.structure?.poreSize) {
    rows.push({
      path: 'structure.poreSize',
      label: 'Pore-size distribution',
      value: `${inputs.structure.poreSize.diameters.length} classes (${inputs.structure.poreSize.form})`,
      unit: '',
      source: fieldSource('structure.poreSize'),
    });
  }

  const liquidName = typeof inputs.liquid.ref === 'string' ? inputs.liquid.ref : inputs.liquid.ref.name;
  rows.push({
    path: 'liquid.ref',
    label: 'Liquid',
    value: inputs.liquid.pinned ? pinnedLabel(inputs.liquid.pinned) : liquidName,
    unit: '',
    source: inputs.liquid.pinned ? 'material library' : typeof inputs.liquid.ref === 'string' ? 'wick-core built-in liquid' : 'entered for this variant',
  });
  if (results?.status === 'ok') {
    const l = results.liquid;
    rows.push(
      { path: 'liquid.surfaceTension', label: 'Surface tension', value: l.surfaceTension, unit: 'N/m', source: l.sources['surfaceTension'] ?? '' },
      { path: 'liquid.viscosity', label: 'Viscosity', value: l.viscosity, unit: 'Pa s', source: l.sources['viscosity'] ?? '' },
      { path: 'liquid.density', label: 'Liquid density', value: l.density, unit: 'kg/m^3', source: l.sources['density'] ?? '' },
    );
  }
  for (const [name, tol] of Object.entries(inputs.tolerances ?? {})) {
    if (!tol) continue;
    const label = TOLERANCE_FIELDS[name as keyof typeof TOLERANCE_FIELDS]?.label ?? name;
    const unit = SI_UNIT[TOLERANCE_FIELDS[name as keyof typeof TOLERANCE_FIELDS]?.dimension ?? 'dimensionless'];
    const n = (x: number) => String(Number(x.toPrecision(6)));
    const text =
      tol.kind === 'normal'
        ? `normal, sd ${n(tol.sd)}${tol.mean !== undefined ? `, mean ${n(tol.mean)}` : ''}`
        : tol.kind === 'uniform'
          ? `uniform ${n(tol.min)} … ${n(tol.max)}`
          : `triangular ${n(tol.min)} … ${n(tol.max)}${tol.mode !== undefined ? `, mode ${n(tol.mode)}` : ''}`;
    rows.push({ path: `tolerances.${name}`, label: `Tolerance: ${label}`, value: text, unit, source: 'entered for this variant' });
  }
  return rows;
}

/**
 * From library entries (a web revision, its fibres, a liquid revision) to a variant's inputs. A blend of
 * several fibres becomes one equivalent fibre through the fibre-bed family's blend rule (blend density and the
 * surface-equivalent diameter 4/S_v), so the variant evaluates exactly the structure the library describes.
 */
import type { FibreData, LiquidData, LiquidPropertyData, PermeabilityData, PropertyValue, WebData } from '../api/library';
import { PROPERTY_SOURCE_LABELS } from '../api/library';
import { DomainError } from '../errors';
import { blendFibres } from '../fibre-bed/blend';
import type { PropertyDefinition, UserLiquidDefinition } from '../liquids/liquid-at';
import type { PermeabilityChoice, PinnedMaterial, StructureInputs } from './variant';

export interface LibraryFibre {
  readonly id: number;
  readonly name: string;
  readonly data: FibreData;
}

export interface StructureFromLibrary {
  /** Contact angle is missing when no fibre of the blend has one for the liquid: the form asks for it. */
  readonly structure: Omit<StructureInputs, 'contactAngle'> & { readonly contactAngle?: number };
  /** Sentences on what was assumed or converted, for the form and the report. */
  readonly notes: readonly string[];
}

function sourceText(p: PropertyValue): string {
  return `${PROPERTY_SOURCE_LABELS[p.source]}${p.note ? `: ${p.note}` : ''}`;
}

/**
 * The library's correlation names as the variant's correlation for in-plane flow in a web: flow runs across
 * the fibres lying in the plane (Happel, Gebart across; Gebart for quadratic packing), and the Tomadakis–Robertson
 * 2-D mat in-plane parameters.
 */
const CORRELATION_MAP: Readonly<Record<string, PermeabilityChoice>> = {
  'kozeny-carman': { mode: 'correlation', correlation: 'kozeny-carman' },
  davies: { mode: 'correlation', correlation: 'davies' },
  happel: { mode: 'correlation', correlation: 'happel-across' },
  'jackson-james': { mode: 'correlation', correlation: 'jackson-james' },
  gebart: { mode: 'correlation', correlation: 'gebart-across-quadratic' },
  'tomadakis-robertson': { mode: 'correlation', correlation: 'tomadakis-robertson-2d-in-plane' },
};

const DEFAULT_CORRELATION: PermeabilityChoice = { mode: 'correlation', correlation: 'tomadakis-robertson-2d-in-plane' };

function permeabilityFrom(p: PermeabilityData | undefined, notes: string[]): { choice: PermeabilityChoice; source?: string } {
  if (!p) {
    notes.push('The web has no in-plane permeability: the Tomadakis–Robertson 2-D in-plane correlation is used.');
    return { choice: DEFAULT_CORRELATION };
  }
  if (p.mode === 'measured') return { choice: { mode: 'measured', value: p.value.si }, source: sourceText(p.value) };
  const mapped = CORRELATION_MAP[p.correlation];
  if (!mapped) {
    notes.push(`The library's correlation "${p.correlation}" is not in wick-core: the Tomadakis–Robertson 2-D in-plane correlation is used.`);
    return { choice: DEFAULT_CORRELATION };
  }
  return { choice: mapped };
}

/**
 * Structure inputs from a pinned web revision, its blend's fibres and the liquid's name (to pick the fibre's
 * contact angle for that liquid). With `aqueous`, a fibre's contact angle with water stands in for an aqueous
 * liquid it has no angle for (saline, simulated urine: common practice, said in the notes).
 * @throws DomainError when a blend fibre is missing or the web has no thickness.
 */
export function structureFromLibrary(
  web: PinnedMaterial & { readonly data: WebData },
  fibres: readonly LibraryFibre[],
  liquidName: string,
  options: { readonly aqueous?: boolean } = {},
): StructureFromLibrary {
  const notes: string[] = [];
  const data = web.data;
  const parts = data.blend.map((part) => {
    const fibre = fibres.find((f) => f.id === part.fibreId);
    if (!fibre) {
      throw new DomainError('invalid-input', `The blend fibre "${part.fibreName}" of ${web.name} is not in the library.`, 'structure.web');
    }
    return { part, fibre };
  });
  if (parts.length === 0) throw new DomainError('invalid-input', `${web.name} has no fibre blend.`, 'structure.web');
  if (!data.thickness) throw new DomainError('invalid-input', `${web.name} has no thickness in the library.`, 'structure.thickness');

  const sources: Record<string, string> = {
    basisWeight: sourceText(data.basisWeight),
    thickness: `${sourceText(data.thickness)}${data.thicknessPressure ? ` (at ${data.thicknessPressure.si} Pa)` : ''}`,
  };
  let fibre: Pick<StructureInputs, 'fibreDiameter' | 'linearDensity' | 'fibreDensity' | 'shapeFactor'>;
  if (parts.length === 1) {
    const f = parts[0].fibre.data;
    fibre = {
      fibreDiameter: f.diameter?.si,
      linearDensity: f.diameter ? undefined : f.linearDensity?.si,
      fibreDensity: f.density.si,
      shapeFactor: f.shapeFactor?.si,
    };
    if (f.diameter) sources['fibreDiameter'] = `${parts[0].fibre.name}: ${sourceText(f.diameter)}`;
    if (!f.diameter && f.linearDensity) sources['linearDensity'] = `${parts[0].fibre.name}: ${sourceText(f.linearDensity)}`;
    sources['fibreDensity'] = `${parts[0].fibre.name}: ${sourceText(f.density)}`;
  } else {
    const blend = blendFibres(
      parts.map(({ part, fibre: f }) => ({
        massFraction: part.massFraction,
        fibreDensity: f.data.density.si,
        diameter: f.data.diameter?.si,
        linearDensity: f.data.linearDensity?.si,
        shapeFactor: f.data.shapeFactor?.si,
        name: f.name,
      })),
    );
    fibre = { fibreDiameter: blend.equivalentDiameter, fibreDensity: blend.fibreDensity, shapeFactor: 1 };
    const names = parts.map(({ part, fibre: f }) => `${f.name} ${Math.round(part.massFraction * 100)} %`).join(', ');
    sources['fibreDiameter'] = `blend ${names}: surface-equivalent diameter 4/S_v`;
    sources['fibreDensity'] = `blend ${names}: 1/ρf = Σ wᵢ/ρᵢ`;
    notes.push(`The blend (${names}) is represented by one equivalent fibre with the same density and specific surface.`);
  }

  // Contact angle: the fibre with the largest mass share that has one for this liquid.
  const wanted = liquidName.trim().toLowerCase();
  const byShare = [...parts].sort((a, b) => b.part.massFraction - a.part.massFraction);
  let contactAngle: number | undefined;
  for (const { fibre: f } of byShare) {
    const hit = f.data.contactAngles.find((c) => c.liquid.trim().toLowerCase() === wanted)
      ?? f.data.contactAngles.find((c) => wanted.includes(c.liquid.trim().toLowerCase()) || c.liquid.trim().toLowerCase().includes(wanted));
    if (hit) {
      contactAngle = hit.angle.si;
      sources['contactAngle'] = `${f.name}, ${hit.liquid}: ${sourceText(hit.angle)} (${hit.method})`;
      break;
    }
  }
  if (contactAngle === undefined && options.aqueous) {
    for (const { fibre: f } of byShare) {
      const water = f.data.contactAngles.find((c) => c.liquid.trim().toLowerCase() === 'water');
      if (water) {
        contactAngle = water.angle.si;
        sources['contactAngle'] = `${f.name}, water (used for ${liquidName}): ${sourceText(water.angle)} (${water.method})`;
        notes.push(`The contact angle with water of ${f.name} is used for ${liquidName} (an aqueous liquid).`);
        break;
      }
    }
  }
  if (contactAngle === undefined) notes.push(`No fibre of ${web.name} has a contact angle for ${liquidName}: enter one.`);

  let porosity: number | undefined;
  if (data.porosityMode === 'measured' && data.porosity) {
    porosity = data.porosity.si;
    sources['porosity'] = sourceText(data.porosity);
  }
  const perm = permeabilityFrom(data.permeabilityInPlane, notes);
  if (perm.source) sources['permeability'] = perm.source;
  if (data.meanFlowPoreSize) sources['poreDiameter'] = sourceText(data.meanFlowPoreSize);
  const psd = data.poreSizeDistribution;
  if (psd) sources['poreSize'] = `${PROPERTY_SOURCE_LABELS[psd.source]}${psd.file ? `: ${psd.file.fileName}` : ''}`;

  const structure: StructureFromLibrary['structure'] = {
    web: { kind: 'web', id: web.id, revision: web.revision, name: web.name, state: web.state },
    ...fibre,
    basisWeight: data.basisWeight.si,
    thickness: data.thickness.si,
    porosity,
    contactAngle,
    poreDiameter: data.meanFlowPoreSize?.si,
    permeability: perm.choice,
    poreSize: psd ? { form: psd.form, diameters: psd.diameters, fractions: psd.fractions } : undefined,
    sources,
  };
  for (const k of Object.keys(structure) as (keyof typeof structure)[]) if (structure[k] === undefined) delete structure[k];
  return { structure, notes };
}

function property(p: LiquidPropertyData): PropertyDefinition {
  return p.mode === 'constant' ? p.value.si : p.points.map((x) => ({ temperature: x.temperature, value: x.value }));
}

function propertySource(p: LiquidPropertyData): string {
  return p.mode === 'constant'
    ? `${sourceText(p.value)} (at ${(p.temperature.si - 273.15).toFixed(1)} °C)`
    : `${PROPERTY_SOURCE_LABELS[p.source]}: table of ${p.points.length} points${p.note ? `, ${p.note}` : ''}`;
}

/** A library liquid revision as a liquid definition the evaluator reads (SI constants or temperature tables). */
export function liquidFromLibrary(pinned: PinnedMaterial & { readonly data: LiquidData }): UserLiquidDefinition {
  const d = pinned.data;
  return {
    id: `library-${pinned.id}-r${pinned.revision}`,
    name: pinned.name,
    surfaceTension: property(d.surfaceTension),
    viscosity: property(d.viscosity),
    density: property(d.density),
    flammable: d.flammable,
    sources: {
      surfaceTension: propertySource(d.surfaceTension),
      viscosity: propertySource(d.viscosity),
      density: propertySource(d.density),
    },
  };
}

/**
 * From a pinned library web (and its blend's fibres) to a stack layer. The structure is the single-layer
 * mapping (`structureFromLibrary`: blend → equivalent fibre, contact angle for the liquid, sources), except that
 * a stack is crossed through its thickness: the web's through-plane permeability is used, and a web without one
 * gets the Tomadakis–Robertson 2-D through-plane correlation. The retention curve comes from the web's
 * pore-size distribution when it has one; otherwise the form asks for van Genuchten or Brooks–Corey parameters.
 */
import type { WebData } from '../api/library';
import { structureFromLibrary, type LibraryFibre } from './from-library';
import type { StackLayerInputs, StackRetentionChoice } from './stack-variant';
import type { PermeabilityChoice, PinnedMaterial, StructureInputs } from './variant';

export interface StackLayerFromLibrary {
  /** The layer; `structure.contactAngle` is missing when no fibre has one for the liquid (the form asks). */
  readonly layer: Omit<StackLayerInputs, 'structure' | 'retention'> & {
    readonly structure: Omit<StructureInputs, 'contactAngle'> & { readonly contactAngle?: number };
    /** Missing when the web has no pore-size distribution (the form asks for parameters). */
    readonly retention?: StackRetentionChoice;
  };
  /** Sentences on what was assumed or converted, for the form and the report. */
  readonly notes: readonly string[];
}

const THROUGH_PLANE_DEFAULT: PermeabilityChoice = { mode: 'correlation', correlation: 'tomadakis-robertson-2d-through-plane' };

/**
 * A stack layer from a pinned web revision.
 * @param web the pinned revision with its data.
 * @param fibres the blend's fibres (library entries).
 * @param liquidName the liquid's name, to pick each fibre's contact angle.
 * @param options `aqueous`: a fibre's angle with water stands in for an aqueous liquid (see structureFromLibrary).
 * @throws DomainError as structureFromLibrary (missing blend fibre, no thickness).
 */
export function stackLayerFromLibrary(
  web: PinnedMaterial & { readonly data: WebData },
  fibres: readonly LibraryFibre[],
  liquidName: string,
  options: { readonly aqueous?: boolean; readonly name?: string } = {},
): StackLayerFromLibrary {
  const through = web.data.permeabilityThroughPlane;
  // The single-layer mapping reads `permeabilityInPlane`: hand it the through-plane data.
  const mapped = structureFromLibrary({ ...web, data: { ...web.data, permeabilityInPlane: through } }, fibres, liquidName, options);
  const notes = mapped.notes.filter((n) => !/in-plane/.test(n));
  let permeability = mapped.structure.permeability;
  const sources = { ...mapped.structure.sources };
  if (!through) {
    permeability = THROUGH_PLANE_DEFAULT;
    notes.push('The web has no through-plane permeability: the Tomadakis–Robertson 2-D through-plane correlation is used.');
  } else if (through.mode === 'correlation' && permeability.mode === 'correlation' && permeability.correlation === 'tomadakis-robertson-2d-in-plane') {
    permeability = THROUGH_PLANE_DEFAULT;
    notes.push(`The library's correlation "${through.correlation}" is not in wick-core: the Tomadakis–Robertson 2-D through-plane correlation is used.`);
  }
  if (through?.mode === 'measured') sources['permeability'] = `through-plane: ${sources['permeability'] ?? 'library'}`;
  const retention: StackRetentionChoice | undefined = mapped.structure.poreSize ? { mode: 'pore-size' } : undefined;
  if (!retention) notes.push(`${web.name} has no pore-size distribution: enter van Genuchten or Brooks–Corey parameters for its retention curve.`);
  return {
    layer: {
      name: options.name ?? web.name,
      structure: { ...mapped.structure, permeability, sources },
      ...(retention ? { retention } : {}),
    },
    notes,
  };
}

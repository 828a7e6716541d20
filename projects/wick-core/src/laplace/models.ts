import type { ModelSpec, ParameterSpec } from '../api/model-spec';
import {
  type GeneralLaplaceInput,
  laplaceBubble,
  laplaceCylinder,
  laplaceSphere,
  type RadiusInput,
  slitMeniscus,
  type SlitMeniscusInput,
  tubeMeniscus,
  type TubeMeniscusInput,
  youngLaplace,
} from './young-laplace';

const surfaceTension: ParameterSpec = {
  name: 'surfaceTension',
  label: 'Surface tension',
  unit: 'mN/m',
  kind: 'number',
  description: 'Liquid–gas surface tension γ (water at 20 °C: 0.0727 N/m).',
};
const contactAngle: ParameterSpec = {
  name: 'contactAngle',
  label: 'Contact angle',
  unit: 'deg',
  kind: 'number',
  description: 'Contact angle θ of the liquid on the solid, measured through the liquid (0–180°).',
};
const radius = (what: string): ParameterSpec => ({
  name: 'radius',
  label: 'Radius',
  unit: 'um',
  kind: 'number',
  description: what,
});

export const laplaceModels: ModelSpec[] = [
  {
    id: 'young-laplace',
    family: 'laplace',
    title: 'Young–Laplace (two principal radii)',
    summary: 'Pressure jump ΔP = γ(1/R1 + 1/R2) across a curved surface with signed principal radii (Young 1805, Laplace 1806).',
    parameters: [
      surfaceTension,
      {
        name: 'radius1',
        label: 'First principal radius',
        unit: 'um',
        kind: 'number',
        description: 'R1, positive when the surface is convex towards the outside, negative when concave.',
      },
      {
        name: 'radius2',
        label: 'Second principal radius',
        unit: 'um',
        kind: 'number',
        optional: true,
        description: 'R2 with the same sign rule; leave empty for a surface flat in that direction.',
      },
    ],
    run: (input) => youngLaplace(input as unknown as GeneralLaplaceInput),
  },
  {
    id: 'laplace-sphere',
    family: 'laplace',
    title: 'Laplace pressure of a droplet',
    summary: 'Pressure inside a spherical droplet or gas bubble in a liquid, ΔP = 2γ/R (Young–Laplace).',
    parameters: [surfaceTension, radius('Droplet or bubble radius R.')],
    run: (input) => laplaceSphere(input as unknown as RadiusInput),
  },
  {
    id: 'laplace-bubble',
    family: 'laplace',
    title: 'Laplace pressure of a soap bubble',
    summary: 'Pressure inside a thin-film bubble with two surfaces, ΔP = 4γ/R (Young–Laplace).',
    parameters: [surfaceTension, radius('Bubble radius R (film much thinner than R).')],
    run: (input) => laplaceBubble(input as unknown as RadiusInput),
  },
  {
    id: 'laplace-cylinder',
    family: 'laplace',
    title: 'Laplace pressure of a liquid cylinder',
    summary: 'Pressure inside a liquid cylinder or thread, ΔP = γ/R (Young–Laplace with R2 → ∞).',
    parameters: [surfaceTension, radius('Cylinder radius R.')],
    run: (input) => laplaceCylinder(input as unknown as RadiusInput),
  },
  {
    id: 'capillary-pressure-tube',
    family: 'laplace',
    title: 'Capillary pressure in a tube',
    summary: 'Capillary pressure of a meniscus in a round capillary, ΔP = 2γ cos θ / r (Young–Laplace).',
    parameters: [surfaceTension, contactAngle, radius('Capillary (pore) radius r.')],
    run: (input) => tubeMeniscus(input as unknown as TubeMeniscusInput),
  },
  {
    id: 'capillary-pressure-slit',
    family: 'laplace',
    title: 'Capillary pressure between parallel plates',
    summary: 'Capillary pressure of a meniscus in a slit of gap w, ΔP = 2γ cos θ / w (Young–Laplace).',
    parameters: [
      surfaceTension,
      contactAngle,
      { name: 'gap', label: 'Gap', unit: 'um', kind: 'number', description: 'Distance w between the plates.' },
    ],
    run: (input) => slitMeniscus(input as unknown as SlitMeniscusInput),
  },
];

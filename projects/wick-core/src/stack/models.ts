import type { ModelSpec } from '../api/model-spec';
import { stackRetentionCurve, type RetentionCurveInput } from './curve';
import { toPlain } from '../api/plain';
import { simulateStack } from './simulate';
import type { StackInput } from './types';

/**
 * The stack family as the CLI, the server and the UI list it. `run` returns JSON-safe results (plain
 * arrays); call simulateStack directly (e.g. in a Web Worker) to keep the typed arrays.
 */
export const stackModels: ModelSpec[] = [
  {
    id: 'stack-flow',
    family: 'stack',
    title: 'Layered stack: liquid uptake and distribution',
    summary:
      'Takes up insults (gushes) or a reservoir in a stack of absorbent layers, or along a core, with the one-dimensional ' +
      'Richards equation (van Genuchten–Mualem, Brooks–Corey–Burdine or pore-size retention; mass-conservative scheme of ' +
      'Celia, Bouloutas & Zarba 1990), and reports saturation maps, acquisition time per insult, liquid left near the ' +
      'surface and the mass balance.',
    parameters: [
      {
        name: 'geometry',
        label: 'Geometry',
        unit: '',
        kind: 'string',
        optional: true,
        default: 'through-plane',
        choices: ['through-plane', 'in-plane'],
        description: 'Through the thickness of a stack, or along a strip or core fed at one edge.',
      },
      {
        name: 'layers',
        label: 'Layers',
        unit: '',
        kind: 'object',
        description:
          'From the inlet inwards: thickness (m), porosity, residualContent, retention {kind: van-genuchten (alpha 1/Pa, n) | ' +
          'brooks-corey (entryPressure Pa, lambda) | pore-size (diameters m, fractions, contactAngle rad)}, permeability (m²) ' +
          'or conductivity (m/s), optional inPlanePermeability, cells, grading, initialSaturation.',
      },
      {
        name: 'liquid',
        label: 'Liquid',
        unit: '',
        kind: 'object',
        description: 'density (kg/m³), viscosity (Pa·s) and, for pore-size layers, surfaceTension (N/m).',
      },
      {
        name: 'inclination',
        label: 'Axis angle to the downward vertical',
        unit: 'deg',
        kind: 'number',
        optional: true,
        description: '0 = liquid poured onto a product lying flat, 90 = horizontal, 180 = wicking upwards.',
      },
      {
        name: 'top',
        label: 'Inlet condition',
        unit: '',
        kind: 'object',
        description:
          "{kind: 'insults', insults: [{start s, volume m³/m², rate m/s}]} | {kind: 'pressure', pressure Pa, until s} | {kind: 'no-flow'}.",
      },
      {
        name: 'bottom',
        label: 'Far-face condition',
        unit: '',
        kind: 'object',
        optional: true,
        description: "{kind: 'no-flow'} (default) | {kind: 'free-drainage'} | {kind: 'pressure', pressure Pa}.",
      },
      {
        name: 'endTime',
        label: 'Simulated time',
        unit: 's',
        kind: 'number',
        description: 'Length of the run.',
      },
      {
        name: 'initialPressure',
        label: 'Initial liquid pressure',
        unit: 'Pa',
        kind: 'number',
        optional: true,
        description: 'For layers without an initial saturation (negative: suction).',
      },
      {
        name: 'cells',
        label: 'Cells',
        unit: '1',
        kind: 'number',
        optional: true,
        default: 100,
        description: 'Cells shared over layers without their own count.',
      },
      {
        name: 'snapshots',
        label: 'Snapshots',
        unit: '1',
        kind: 'number',
        optional: true,
        default: 61,
        description: 'Saturation profiles stored, evenly spaced in time.',
      },
      {
        name: 'upperLayers',
        label: 'Upper layers for rewet',
        unit: '1',
        kind: 'number',
        optional: true,
        default: 1,
        description: 'How many layers from the inlet count towards the liquid left near the surface.',
      },
      {
        name: 'frontThreshold',
        label: 'Front threshold',
        unit: '1',
        kind: 'number',
        optional: true,
        default: 0.05,
        description: 'Rise in saturation that marks the wetting front.',
      },
      {
        name: 'solver',
        label: 'Solver settings',
        unit: '',
        kind: 'object',
        optional: true,
        description: 'initialStep, minStep, maxStep (s), maxIterations, maxSaturationChange, faceConductivity (arithmetic | upstream | harmonic).',
      },
    ],
    run: (input) => toPlain(simulateStack(input as unknown as StackInput)),
  },
  {
    id: 'stack-retention-curve',
    family: 'stack',
    title: 'Layer retention and relative permeability',
    summary:
      'Saturation and relative permeability of a layer against capillary pressure, as the stack model uses them ' +
      '(van Genuchten 1980 with Mualem 1976, Brooks & Corey 1964 with Burdine, or a capillary-bundle fit of a pore-size distribution).',
    parameters: [
      {
        name: 'layer',
        label: 'Layer',
        unit: '',
        kind: 'object',
        description: 'As one entry of the stack model’s layers.',
      },
      {
        name: 'liquid',
        label: 'Liquid',
        unit: '',
        kind: 'object',
        description: 'density, viscosity, surfaceTension (pore-size layers).',
      },
      {
        name: 'pressures',
        label: 'Capillary pressures',
        unit: 'Pa',
        kind: 'number[]',
        optional: true,
        description: 'Where to evaluate the curve.',
      },
      {
        name: 'points',
        label: 'Points',
        unit: '1',
        kind: 'number',
        optional: true,
        default: 60,
        description: 'Log-spaced points when no pressures are given.',
      },
    ],
    run: (input) => toPlain(stackRetentionCurve(input as unknown as RetentionCurveInput)),
  },
];

import type { ModelSpec, ParameterSpec } from '../api/model-spec';
import { referenceLiquidContactAngle, type ReferenceLiquidInput } from './contact-angle';
import { fitGravityWashburn, type GravityFitInput } from './gravity-fit';
import { predictionError, type PredictionErrorInput } from './metrics';
import { replicateStatistics, type ReplicateInput } from './replicates';
import { toPlain } from '../api/plain';
import { fitWashburnSlope, type WashburnSlopeInput } from './washburn-slope';

const series: ParameterSpec[] = [
  { name: 'time', label: 'Time', unit: 's', kind: 'number[]', description: 'Reading times, increasing, from contact with the liquid.' },
  {
    name: 'values',
    label: 'Height or mass',
    unit: '',
    kind: 'number[]',
    description: 'Wetted heights in m (or uptake masses in kg with quantity "mass"), SI.',
  },
  {
    name: 'quantity',
    label: 'Measured quantity',
    unit: '',
    kind: 'string',
    optional: true,
    default: 'height',
    choices: ['height', 'mass'],
    description: 'What the values are.',
  },
];

export const fittingModels: ModelSpec[] = [
  {
    id: 'fit-washburn-slope',
    family: 'fitting',
    title: 'Washburn slope of lab data',
    summary:
      'Least-squares slope of height² (or mass²) against time over a time window, with R², residuals and a Student-t 95 % ' +
      'interval, and an automatic window that leaves out inertial start and gravity-slowed end (Washburn 1921).',
    parameters: [
      ...series,
      {
        name: 'window',
        label: 'Time window',
        unit: '',
        kind: 'object',
        optional: true,
        default: 'auto',
        description: '"auto" (suggested window), "all", or {start, end} in s.',
      },
      {
        name: 'intercept',
        label: 'Fit an intercept',
        unit: '',
        kind: 'boolean',
        optional: true,
        default: false,
        description: 'Allow a non-zero intercept (time-zero offset or contact jump).',
      },
    ],
    run: (input) => toPlain(fitWashburnSlope(input as unknown as WashburnSlopeInput)),
  },
  {
    id: 'fit-gravity-washburn',
    family: 'fitting',
    title: 'Gravity-restrained Washburn fit of lab data',
    summary:
      'Fits dh/dt = a/h − b to measured heights (Levenberg–Marquardt; Washburn 1921, Fries & Dreyer 2008), giving the ' +
      'equilibrium height, rate constants with 95 % intervals and, with liquid data, effective radii or permeability and capillary pressure.',
    parameters: [
      ...series,
      { name: 'surfaceTension', label: 'Surface tension', unit: 'mN/m', kind: 'number', optional: true, description: 'For effective radii.' },
      { name: 'contactAngle', label: 'Contact angle', unit: 'deg', kind: 'number', optional: true, description: 'For effective radii (0° if omitted).' },
      { name: 'density', label: 'Liquid density', unit: 'kg/m^3', kind: 'number', optional: true, description: 'For derived figures.' },
      { name: 'viscosity', label: 'Viscosity', unit: 'mPa s', kind: 'number', optional: true, description: 'For derived figures.' },
      { name: 'porosity', label: 'Porosity', unit: '1', kind: 'number', optional: true, description: 'For permeability and capillary pressure.' },
      { name: 'gravity', label: 'Gravity', unit: 'm/s^2', kind: 'number', optional: true, default: 9.80665, description: 'Gravitational acceleration.' },
      { name: 'tilt', label: 'Tilt from horizontal', unit: 'deg', kind: 'number', optional: true, default: 90, description: 'Sample tilt; above 0°.' },
    ],
    run: (input) => toPlain(fitGravityWashburn(input as unknown as GravityFitInput)),
  },
  {
    id: 'contact-angle-reference-liquid',
    family: 'fitting',
    title: 'Contact angle by the reference-liquid (Washburn) method',
    summary:
      'Contact angle of a test liquid from Washburn mass-uptake slopes m²/t of the test liquid and of a fully wetting ' +
      'reference liquid on identically packed samples (m² = C ρ² γ cosθ t/η; Washburn 1921), replicates pooled. ' +
      'Reference solvents such as n-hexane are flammable: fume hood, no ignition sources, follow the safety data sheet.',
    parameters: [
      {
        name: 'reference',
        label: 'Reference liquid',
        unit: '',
        kind: 'object',
        description: 'Fully wetting liquid: {surfaceTension N/m, density kg/m³, viscosity Pa·s, slopes kg²/s[]}, SI.',
      },
      {
        name: 'test',
        label: 'Test liquid',
        unit: '',
        kind: 'object',
        description: 'Test liquid: {surfaceTension N/m, density kg/m³, viscosity Pa·s, slopes kg²/s[]}, SI.',
      },
      {
        name: 'quantity',
        label: 'Slopes of',
        unit: '',
        kind: 'string',
        optional: true,
        default: 'mass',
        choices: ['mass', 'height'],
        description: 'mass: slopes dm²/dt in kg²/s (densities needed); height: slopes dh²/dt in m²/s (no density).',
      },
    ],
    run: (input) => toPlain(referenceLiquidContactAngle(input as unknown as ReferenceLiquidInput)),
  },
  {
    id: 'replicate-statistics',
    family: 'fitting',
    title: 'Replicate runs: spread and outliers',
    summary:
      'Mean, standard deviation and coefficient of variation of a fitted value over replicate runs, with outlier runs ' +
      'flagged by the modified z-score (Iglewicz & Hoaglin 1993).',
    parameters: [
      { name: 'values', label: 'Values', unit: '', kind: 'number[]', description: 'One fitted value per run, in SI units (any one quantity).' },
      { name: 'labels', label: 'Run labels', unit: '', kind: 'object', optional: true, description: 'Optional label per run.' },
      { name: 'threshold', label: 'Cut-off', unit: '1', kind: 'number', optional: true, default: 3.5, description: 'Modified z-score cut-off.' },
    ],
    run: (input) => toPlain(replicateStatistics(input as unknown as ReplicateInput)),
  },
  {
    id: 'prediction-error',
    family: 'fitting',
    title: 'Prediction versus measurement',
    summary: 'RMSE, mean bias, largest deviation and time-to-height errors of a predicted uptake curve against a measured one.',
    parameters: [
      { name: 'measured', label: 'Measured curve', unit: '', kind: 'object', description: '{time s[], values m[]}, SI.' },
      { name: 'predicted', label: 'Predicted curve', unit: '', kind: 'object', description: '{time s[], values m[]}, SI.' },
      { name: 'heights', label: 'Target heights', unit: 'mm', kind: 'number[]', optional: true, description: 'Heights for time-to-height errors.' },
    ],
    run: (input) => toPlain(predictionError(input as unknown as PredictionErrorInput)),
  },
];

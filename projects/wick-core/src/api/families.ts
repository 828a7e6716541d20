/** Every model family's specs, in the order `wick list` shows them. */
import type { ModelSpec } from './model-spec';
import { unitsModels } from '../units/models';
import { liquidsModels } from '../liquids/models';
import { laplaceModels } from '../laplace/models';
import { kelvinModels } from '../kelvin/models';
import { jurinModels } from '../jurin/models';
import { washburnModels } from '../washburn/models';
import { fibreBedModels } from '../fibre-bed/models';
import { permeabilityModels } from '../permeability/models';
import { poreSizeModels } from '../pore-size/models';
import { toleranceModels } from '../tolerance/models';
import { fittingModels } from '../fitting/models';
import { stackModels } from '../stack/models';
import { designModels } from '../design/models';

export const MODEL_FAMILIES: ReadonlyArray<readonly ModelSpec<never, unknown>[]> = [
  unitsModels,
  liquidsModels,
  laplaceModels,
  kelvinModels,
  jurinModels,
  washburnModels,
  fibreBedModels,
  permeabilityModels,
  poreSizeModels,
  toleranceModels,
  fittingModels,
  stackModels,
  designModels,
];

/*
 * Public API of wick-core: the only door into the physics library.
 */
export * from './errors';
export * from './validate';
export * from './constants';
export * from './version';
export * from './api/model-spec';
export * from './api/wire';
export * from './api/permissions';
export * from './api/compute';
export * from './api/plain';
export * from './units';
export * from './liquids';
export * from './laplace';
export * from './kelvin';
export * from './jurin';
export * from './numeric';
export * from './washburn';
export * from './fibre-bed';
export * from './permeability';
export * from './pore-size';
export * from './tolerance';
export * from './fitting';
export * from './stack';
export * from './api/library';
export * from './design';
export * from './api/lab-data';

export * from './fibre';
export * from './blend';
export * from './bed';
export * from './models';

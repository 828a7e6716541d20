export * from './gravity';
export * from './capillary';
export * from './inertia';
export * from './checkpoints';
export * from './porous-strip';
export * from './radial';
export * from './models';

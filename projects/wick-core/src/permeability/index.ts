export * from './correlations';
export * from './models';

export * from './lambert-w';

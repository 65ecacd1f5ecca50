export * from './errors';
export * from './session';
export * from './admin';
export * from './courses';

export * from './constants';
export * from './convert';

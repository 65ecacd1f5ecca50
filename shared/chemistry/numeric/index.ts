export * from './quadrature';
export * from './minimize';

export { EULER_GAMMA } from './euler-gamma';
export { exponentialIntegralE1 } from './exponential-integral-e1';
export { scaledExponentialIntegralE1 } from './scaled-exponential-integral-e1';
export { exponentialIntegralEi } from './exponential-integral-ei';
export { exponentialIntegralEin } from './exponential-integral-ein';

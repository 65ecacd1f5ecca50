export { findSimilarReports, type SimilarityReport, type SimilarityFlag, type SimilarityKind, type SimilarityOptions } from './find-similar-reports';
export { typedPrecision, significantDigits, type TypedPrecision } from './typed-precision';

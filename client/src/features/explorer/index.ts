/** Public pieces of the explorer feature, for other screens (exercise editor, marking). */
export { ReferencePreview, type ReferencePreviewProps } from './components/reference-preview';
export { CurvePlot, curvesCsv, type CurvePlotProps, type CurveSeries, type CurveMarker, type CurveSecondPanel, type SeriesKind } from './components/curve-plot';
export { MoDiagramSvg, type MoDiagramSvgProps } from './components/mo-diagram-svg';
export { MoDiagramView } from './components/mo-diagram-view';
export { HuckelView, HuckelLevelsSvg } from './components/huckel-levels';
export { PlotFrame } from './components/plot-frame';
export { CurveAnalysisTable, type CurveAnalysisRow } from './components/curve-analysis-table';
export type { PlotUnits } from './lib/units';
export { VariantAnswerKey, type VariantAnswerKeyProps } from './components/variant-answer-key';

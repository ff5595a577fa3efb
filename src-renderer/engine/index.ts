/**
 * Public surface of the engine: the pure TypeScript core shared by the app, its Web
 * Workers and the command line. Import from here rather than from individual files.
 *
 * Results are for review by a qualified engineer; they are not a substitute for the
 * operator's well-control policy and defer to local regulations and licensed practice.
 */
// Core types and errors
export * from './errors';
export * from './record';
export * from './result';
export type { AnalysisOptions } from './analysis-options';
export * from './units/index';

// Import
export { importTestFile, detectColumns, detectImportFormat, type ImportFormat, type ImportOptions, type ColumnOverride, type TablePreview } from './import/import-test-file';

// Analysis pipeline
export { analyzeRecord, analyzeFile, DEPARTURE_LIMIT_KEY } from './analyze';
export { segmentCycles, type SegmentationOptions, type SegmentationInput } from './analysis/segmentation';
export { inferTestType, rateLevels, TYPE_RULES, type InferredType, type TypeEvidence } from './analysis/type-inference';
export { downholePressure, fluidColumnPressure, type DownholePressure } from './analysis/downhole';
export { analyseLoading, pickAt, LOADING_METHODS, DEFAULT_DEPARTURE_SD, type LoadingFeatures, type LoadingOptions } from './analysis/loading-picks';
export { assembleCyclePicks, primaryClosure, CLOSURE_PREFERENCE, type CyclePickInput } from './analysis/cycle-picks';
export { applyManualPicks } from './analysis/manual-picks';
export { medianOf, quantileOf, noiseStandardDeviation, recordingStep, quantisationStep } from './analysis/robust-statistics';
export { fitLine, fitLineThroughOrigin, fitLinearModel, RunningLineFit, type LineFitWithErrors, type LinearModelFit } from './analysis/least-squares';
export { gFunction, gFunctionSeries, type GFunctionAlpha } from './analysis/gfunction';
export { isipPick, closurePick, closureCandidates, closureSpread, gFunctionDiagnostic, CLOSURE_METHODS, type ClosureMethod, type ShutInOptions, type GFunctionDiagnostic } from './analysis/shut-in';
export { stepRateAnalysis, rateSteps, type StepRateOptions } from './analysis/step-rate';
export { expectedLoadingSlope, mudCompressibility, systemVolumeFromGeometry, type ExpectedLoadingSlope } from './analysis/stiffness';

// Stresses and quality
export { estimateStresses, shminFromPicks, SHMIN_HIERARCHY, type StressEstimateOptions } from './stress/estimates';
export { assessQuality } from './quality/assess';
export { DEFAULT_LIMITS, resolveLimits, limitDefinition, type QualityLimit, type LimitValues } from './quality/limits';

// Synthetic records (demo data, tests)
export { generateSyntheticTest, eventPressures, type EventPressures } from './synthetic/generate';
export type { SyntheticSpec, SyntheticTruth, SyntheticFlaws, TruthCycle, TruthEvent } from './synthetic/spec';

// Safety caution for every export and report
export { SAFETY_CAUTION } from './export/safety';

/** File import: delimited text, XLSX and LAS into the normalised SI TestRecord or DepthLog. */
export * from './import-test-file';
export { validateImportOptions } from './importOptions';
export { checkImportOptions, importOptionsNeedNoCheck } from './importOptionsCheck';
export { volumeFromRate, rateFromVolume, differenceHalfWidth, fillGaps } from './rateVolume';
export { testTypeFromText } from './metadataFields';
export { PHYSICAL_RANGES, MINIMUM_PRESSURE } from './physicalRanges';

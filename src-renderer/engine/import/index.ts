/** File import: delimited text, XLSX and LAS into the normalised SI TestRecord or DepthLog. */
export * from './import-test-file';
export { volumeFromRate, rateFromVolume, differenceHalfWidth, fillGaps } from './rateVolume';
export { testTypeFromText } from './metadataFields';
export { PHYSICAL_RANGES, MINIMUM_PRESSURE } from './physicalRanges';

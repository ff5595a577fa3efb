/** Units: exact SI factors, unit-name recognition, quantity parsing, display systems, EMW. */
export * from './quantity';
export * from './unitDefinitions';
export { normaliseUnitName } from './unitNames';
export { unitDimension, unitFactorToSI, toSI, fromSI, arrayToSI, unitsOfDimension } from './units';
export { parseQuantity, type ParsedQuantity, type QuantityKind } from './parseQuantity';
export * from './unitSystem';
export * from './mudWeight';

/**
 * Reading of a value with its unit as typed on the command line or in a metadata cell:
 * "1520m", "4987 ft", "1.25sg", "10.4ppg", "0.45psi/ft", "5e-10/Pa", "3,4e-6 1/psi".
 */
import { EngineError, type SourceLocation } from '../errors';
import { SI_UNIT, type Dimension } from './unitDefinitions';
import { normaliseUnitName } from './unitNames';
import { unitDimension, unitFactorToSI } from './units';

/** What parseQuantity may be asked for; 'pressureOrGradient' accepts either (pore pressure, Sv). */
export type QuantityKind = Dimension | 'pressureOrGradient';

/** A parsed value: SI number, its dimension and the unit as written. */
export interface ParsedQuantity {
  value: number;
  dimension: Dimension;
  unitWritten: string;
}

/** Unit assumed when none is written, per requested kind (the SI display unit). */
const DEFAULT_UNIT: Readonly<Record<QuantityKind, string>> = {
  pressure: 'MPa', length: 'm', time: 's', rate: 'm3/min', volume: 'm3', density: 'sg',
  gradient: 'kPa/m', compressibility: '1/Pa', pressureOrGradient: 'MPa',
};

const NUMBER_THEN_UNIT = /^\s*([+-]?(?:\d+(?:[.,]\d*)?|[.,]\d+)(?:[eE][+-]?\d+)?)\s*(.*?)\s*$/;

/**
 * Reads a number followed by a unit and converts it to SI. Without a unit the SI display
 * unit of the kind is assumed (MPa, m, s, m3/min, m3, sg, kPa/m, 1/Pa). A decimal comma is
 * accepted. Densities asked for as a gradient (or pressureOrGradient) become the hydrostatic
 * gradient rho x g_n.
 *
 * @param text e.g. "1520m", "10.4ppg", "0.45psi/ft"
 * @param kind dimension expected
 * @param location where the text came from, for errors
 * @returns {value (SI), dimension, unitWritten}
 * @throws EngineError 'bad-argument' when there is no number; 'unknown-unit' for an unknown unit
 *   or one of the wrong dimension
 * @example parseQuantity('4987ft', 'length').value // 1520.0376
 */
export function parseQuantity(text: string, kind: QuantityKind, location: SourceLocation = {}): ParsedQuantity {
  const match = NUMBER_THEN_UNIT.exec(text);
  if (!match) {
    throw new EngineError('bad-argument', `"${text}" is not a number with a unit`, location, `a ${kind} such as ${exampleOf(kind)}`);
  }
  const value = Number(match[1].replace(',', '.'));
  const unitWritten = match[2];
  const unit = unitWritten === '' ? DEFAULT_UNIT[kind] : unitWritten;
  const dimension = dimensionFor(unit, kind, location);
  return { value: value * unitFactorToSI(unit, dimension, location), dimension, unitWritten };
}

/** Resolves the dimension of the unit for the requested kind. */
function dimensionFor(unit: string, kind: QuantityKind, location: SourceLocation): Dimension {
  if (kind !== 'pressureOrGradient') return kind;
  const found = unitDimension(unit);
  if (found === 'pressure') return 'pressure';
  if (found === 'gradient' || found === 'density') return 'gradient';
  const what = normaliseUnitName(unit) ? `"${unit}" is not a pressure or gradient unit` : `unknown unit "${unit}"`;
  throw new EngineError('unknown-unit', what, location, 'a pressure (MPa, psi, bar) or a gradient (kPa/m, psi/ft, sg, ppg)');
}

function exampleOf(kind: QuantityKind): string {
  return kind === 'pressureOrGradient' ? '"21.3MPa" or "10.2kPa/m"' : `"1.0${DEFAULT_UNIT[kind]}" (SI: ${SI_UNIT[kind]})`;
}

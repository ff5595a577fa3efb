/**
 * Branded SI quantities. Inside the engine every scalar is SI (Pa, m, s, m3, m3/s,
 * kg/m3, 1/Pa, Pa/m); the brand makes passing metres where pascals are expected a
 * compile error. Arrays of samples are plain Float64Array in the same SI units.
 */
declare const unitBrand: unique symbol;
export type Quantity<U extends string> = number & { readonly [unitBrand]: U };

export type Pascal = Quantity<'Pa'>;
export type Metre = Quantity<'m'>;
export type Second = Quantity<'s'>;
export type CubicMetre = Quantity<'m3'>;
export type CubicMetrePerSecond = Quantity<'m3/s'>;
export type KilogramPerCubicMetre = Quantity<'kg/m3'>;
/** Compressibility, 1/Pa. */
export type PerPascal = Quantity<'1/Pa'>;
/** Pressure gradient, Pa/m. */
export type PascalPerMetre = Quantity<'Pa/m'>;
/** Loading stiffness dP/dV, Pa/m3. */
export type PascalPerCubicMetre = Quantity<'Pa/m3'>;

export const pascal = (v: number): Pascal => v as Pascal;
export const metre = (v: number): Metre => v as Metre;
export const second = (v: number): Second => v as Second;
export const cubicMetre = (v: number): CubicMetre => v as CubicMetre;
export const cubicMetrePerSecond = (v: number): CubicMetrePerSecond => v as CubicMetrePerSecond;
export const kgPerCubicMetre = (v: number): KilogramPerCubicMetre => v as KilogramPerCubicMetre;
export const perPascal = (v: number): PerPascal => v as PerPascal;
export const pascalPerMetre = (v: number): PascalPerMetre => v as PascalPerMetre;
export const pascalPerCubicMetre = (v: number): PascalPerCubicMetre => v as PascalPerCubicMetre;

/** Standard acceleration of gravity, m/s2, exact (CODATA; NIST SP 811). */
export const STANDARD_GRAVITY = 9.80665;

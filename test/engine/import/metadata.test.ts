import { describe, expect, it } from 'vitest';
import { metadataEntryOfRow } from '../../../src-renderer/engine/import/metadataEntries';
import { readMetadataEntries, testTypeFromText } from '../../../src-renderer/engine/import/metadataFields';

const FT = 0.3048; // NIST SP 811 (exact)
const IN = 0.0254;
const PPG = 119.8264273168966; // lb/US gal in kg/m3 (SP 811 derivation, constants_and_derivations.json)

/** Reads metadata rows written as cells. */
function read(rows: string[][]) {
  const entries = rows.map((r, i) => metadataEntryOfRow(r, { line: i + 1 })).filter((e) => e !== null);
  return readMetadataEntries(entries);
}

describe('metadata block', () => {
  it('should split "key: value", "key = value", key/value cells and key/value/unit cells', () => {
    expect(metadataEntryOfRow(['Well: HF-3'], {})).toMatchObject({ key: 'Well', value: 'HF-3' });
    expect(metadataEntryOfRow(['TVD = 2033 m'], {})).toMatchObject({ key: 'TVD', value: '2033 m' });
    expect(metadataEntryOfRow(['TVD', '2033', 'm'], {})).toMatchObject({ key: 'TVD', value: '2033 m' });
    expect(metadataEntryOfRow(['Date: 2026-11-03 14:22'], {})).toMatchObject({ key: 'Date', value: '2026-11-03 14:22' });
    expect(metadataEntryOfRow(['-----------'], {})).toBeNull();
    expect(metadataEntryOfRow(['Remarks'], {})).toBeNull();
  });

  it('should read depths with units in the value or the key, and tell TVD from MD', () => {
    const { metadata, warnings } = read([
      ['Test depth TVD (ft)', '6670'], ['Test depth MD: 2150 m'], ['Shoe depth TVD: 2030 m'], ['Casing shoe MD', '6680 ft'], ['Depth', '2000 m'],
    ]);
    expect(metadata.depthTvd).toBeCloseTo(6670 * FT, 9);
    expect(metadata.depthMd).toBe(2150);
    expect(metadata.casingShoeTvd).toBe(2030);
    expect(metadata.casingShoeMd).toBeCloseTo(6680 * FT, 9);
    expect(warnings.some((w) => /does not say TVD or MD/.test(w))).toBe(true);
  });

  it('should read mud density in sg, ppg, kg/m3, g/cc and by magnitude when no unit is written', () => {
    expect(read([['Mud weight (ppg)', '10.4']]).metadata.mudDensity).toBeCloseTo(10.4 * PPG, 9);
    expect(read([['MW: 1.25 g/cc']]).metadata.mudDensity).toBe(1250);
    expect(read([['Fluid density: 1250 kg/m³']]).metadata.mudDensity).toBe(1250);
    const guessed = read([['Mud weight', '1.18']]);
    expect(guessed.metadata.mudDensity).toBe(1180);
    expect(guessed.warnings[0]).toMatch(/sg assumed/);
  });

  it('should read diameters in inches with fractions, volumes, compressibility and gauge data', () => {
    const { metadata } = read([
      ['Hole size: 12 1/4 in'], ['Bit size', '8-1/2'], ['Casing ID (in)', '8.681'], ['System volume: 390 bbl'],
      ['Compressibility: 5e-10 1/Pa'], ['Gauge range: 690 bar'], ['Gauge position: bottom hole'], ['Surface line volume: 0.4 m3'],
    ]);
    expect(metadata.holeDiameter).toBeCloseTo(8.5 * IN, 12); // last one written wins
    expect(metadata.casingInnerDiameter).toBeCloseTo(8.681 * IN, 12);
    expect(metadata.systemVolume).toBeCloseTo(390 * 0.158987294928, 9);
    expect(metadata.compressibility).toBe(5e-10);
    expect(metadata.gaugeRange).toBe(690e5);
    expect(metadata.gaugePosition).toBe('downhole');
    expect(metadata.surfaceLineVolume).toBe(0.4);
  });

  it('should read pore pressure as a pressure, a gradient or an EMW once TVD is known', () => {
    // gradient x TVD; EMW rho x g_n x TVD (g_n = 9.80665, CODATA exact)
    expect(read([['Pore pressure: 21.3 MPa']]).metadata.porePressure).toBe(21.3e6);
    expect(read([['Pore pressure: 10.2 kPa/m'], ['TVD: 2000 m']]).metadata.porePressure).toBeCloseTo(20.4e6, 3);
    expect(read([['TVD: 2000 m'], ['Pp', '1.04 sg']]).metadata.porePressure).toBeCloseTo(1040 * 9.80665 * 2000, 3);
    const noDepth = read([['Pore pressure: 0.45 psi/ft']]);
    expect(noDepth.metadata.porePressure).toBeUndefined();
    expect(noDepth.metadata.extra?.['Pore pressure']).toBe('0.45 psi/ft');
  });

  it('should recognise test types as written', () => {
    // trade terms (common practice): FIT, LOT, XLOT, SRT (step-rate), DFIT (mini-frac)
    expect(['FIT', 'Formation integrity test', 'LOT', 'Leak-off test', 'Extended leak-off', 'XLOT', 'Step rate test', 'DFIT', 'Mini-frac', 'casing test']
      .map(testTypeFromText)).toEqual(['fit', 'fit', 'lot', 'lot', 'xlot', 'xlot', 'srt', 'dfit', 'dfit', null]);
  });

  it('should keep unknown keys as written and read dates', () => {
    const { metadata } = read([['Rig', 'Harrow Flats Rig 2'], ['Date: 03.11.2026']]);
    expect(metadata.extra).toEqual({ Rig: 'Harrow Flats Rig 2' });
    expect(metadata.date).toBe('2026-11-03');
  });
});

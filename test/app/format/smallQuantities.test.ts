import { describe, expect, it } from 'vitest';
import { fromDisplay, formatQuantity, formatSmallVolume, toDisplay, unitLabel } from '../../../src-renderer/app/format/units';
import { metadataOverrides, metadataText } from '../../../src-renderer/app/state/importBatch';
import { metre } from '../../../src-renderer/engine/units/quantity';

describe('diameters and small volumes', () => {
  it('should show a hole diameter in inches or millimetres, not in the depth unit', () => {
    // NIST SP 811 (2008) Appendix B.8: 1 in = 2.54 E-02 m (exact). A 12 1/4 in bit (common practice) is 0.31115 m.
    expect(formatQuantity('oilfield', 'diameter', 0.31115)).toBe('12.250 in');
    expect(formatQuantity('si', 'diameter', 0.31115)).toBe('311.2 mm');
    expect(unitLabel('oilfield', 'diameter')).toBe('in');
    expect(unitLabel('si', 'diameter')).toBe('mm');
    expect(fromDisplay('oilfield', 'diameter', 8.5)).toBeCloseTo(8.5 * 0.0254, 12);
    expect(toDisplay('si', 'diameter', 0.2159)).toBeCloseTo(215.9, 9);
  });

  it('should take a typed hole diameter in the shown unit and store metres', () => {
    // NIST SP 811 Appendix B.8: 1 in = 0.0254 m exactly; 8 1/2 in = 0.2159 m.
    const oil = metadataOverrides({ holeDiameter: '8.5' }, 'oilfield', '');
    expect(oil.problems).toEqual([]);
    expect(oil.overrides.holeDiameter).toBeCloseTo(0.2159, 12);
    const si = metadataOverrides({ holeDiameter: '311,15' }, 'si', '');
    expect(si.overrides.holeDiameter).toBeCloseTo(0.31115, 12);
    expect(metadataText({ holeDiameter: metre(0.31115) }, 'holeDiameter', 'diameter', 'oilfield')).toBe('12.25');
  });

  it('should show a small fracture volume once, in litres or US gallons', () => {
    // NIST SP 811 Appendix B.8: 1 gal (US) = 3.785412 E-03 m3; 1 L = 1 E-03 m3.
    expect(formatSmallVolume('si', 4.71e-4)).toBe('0.47 L');
    expect(formatSmallVolume('oilfield', 4.71e-4)).toBe('0.12 gal');
    expect(formatSmallVolume('oilfield', 3.785411784e-2)).toBe('10.0 gal');
    expect(formatSmallVolume('si', 2.3e-5)).toBe('0.023 L');
    expect(formatSmallVolume('si', null)).toBe('–');
  });
});

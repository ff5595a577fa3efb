import { describe, expect, it } from 'vitest';
import { REOPENING_CAUTION, reopeningPoint, shmaxBoundsAtDepth } from '../../../src-renderer/engine/model/shmax-bounds';

describe('shmax-bounds', () => {
  it('should bound SHmax by Shmin and the frictional limit Pp + q (Shmin - Pp)', () => {
    // Zoback (2007) ch. 4 stress polygon, q = [sqrt(0.36 + 1) + 0.6]^2 = 3.1194 for mu = 0.6.
    const q = (Math.sqrt(0.6 ** 2 + 1) + 0.6) ** 2;
    const b = shmaxBoundsAtDepth(34e6, 45.2e6, 20e6);
    expect(b.low).toBe(34e6);
    expect(b.high).toBeCloseTo(20e6 + q * 14e6, 0);
    expect(b.shminLowerBound).toBeCloseTo(20e6 + 25.2e6 / q, 0);
    expect(b.regimeText).toBe('normal or strike-slip');
  });

  it('should tell the normal regime when even the upper bound stays below Sv', () => {
    // Shmin = 25 MPa, Pp = 20, Sv = 45.2: high = 20 + 3.12 x 5 = 35.6 MPa < Sv, so Sv is S1.
    expect(shmaxBoundsAtDepth(25e6, 45.2e6, 20e6).regime).toBe('normal');
    // Shmin above Sv: reverse (Anderson 1951).
    expect(shmaxBoundsAtDepth(50e6, 45e6, 20e6).regime).toBe('reverse');
  });

  it('should attach the reopening caution and test the point against the bounds', () => {
    const p = reopeningPoint({ testId: 't1', well: 'HF-2', tvd: 2033, shmax: 41e6, cautions: ['detectability: fracture must reach 0.4 m'] }, 33.6e6, 45e6, 20e6);
    expect(p.cautions[0]).toBe(REOPENING_CAUTION);
    expect(p.cautions).toContain('detectability: fracture must reach 0.4 m');
    expect(p.insideBounds).toBe(true);
    expect(p.regime).toBe('normal');
    const outside = reopeningPoint({ testId: 't2', well: 'HF-2', tvd: 2033, shmax: 90e6, cautions: [] }, 33.6e6, 45e6, 20e6);
    expect(outside.insideBounds).toBe(false);
    expect(outside.cautions.join(' ')).toMatch(/outside the frictional bounds/);
  });
});

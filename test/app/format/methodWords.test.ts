import { describe, expect, it } from 'vitest';
import { messageWords, methodWords, stressMethodWords } from '../../../src-renderer/app/format/methodWords';

describe('methodWords', () => {
  it('should name the pick methods in plain words', () => {
    // Method ids as the engine writes them (engine/analysis/loading-picks.ts, closure picks); the words are set here.
    expect(methodWords('departure-from-linear-loading')).toBe('departure from the straight loading line');
    expect(methodWords('g-dpdg-tangent')).toBe('G-function, G dP/dG leaves the line through the origin');
    expect(methodWords('manual')).toBe('set by hand');
  });

  it('should show an unknown method id with spaces for its dashes', () => {
    expect(methodWords('some-new-method')).toBe('some new method');
  });

  it('should write the SHmax method line in plain words', () => {
    // The line of engine/stress/estimates.ts; the Greek mu is the usual symbol of the friction coefficient (common practice).
    expect(stressMethodWords('reopening-relation (cycle 2) with frictional-limit bounds (mu 0.6)'))
      .toBe('reopening relation (cycle 2) with frictional limit bounds (μ 0.6)');
  });
});

describe('messageWords', () => {
  it('should write R², m³ and the closure method names in criterion messages', () => {
    // Sentences shaped like engine/quality/criteria messages; the expected typography is set here.
    expect(messageWords('straight: R2 1.0000 over 44 samples; slope 35.14 MPa/m3')).toBe('straight: R² 1.0000 over 44 samples; slope 35.14 MPa/m³');
    expect(messageWords('agree within 2.2 %: g-dpdg-tangent 11.24 MPa, sqrt-time 11.38 MPa, bilinear-dpdt 11.13 MPa.'))
      .toBe('agree within 2.2 %: G-function 11.24 MPa, square root of time 11.38 MPa, bilinear dP/dt 11.13 MPa.');
  });

  it('should leave words that only contain R2 or m3 alone', () => {
    expect(messageWords('minR2 and m3/s')).toBe('minR2 and m³/s');
  });
});

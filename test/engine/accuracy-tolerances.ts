/**
 * Tolerances for comparing automatic picks with the truth a synthetic record was built with
 * (synthetic/generate.ts; demo/manifest.json). Each one is derived from the record's noise,
 * sampling and the shape the generator gives the event, so a stated tolerance says why a
 * pick may differ from the truth by that much. Pressures in Pa, times in s.
 */
import type { PickKind } from '../../src-renderer/engine/result';

/** What a tolerance depends on, all from the spec or the truth, never from the analysis. */
export interface ToleranceInput {
  /** Gaussian noise SD of the gauge, Pa. */
  noiseSd: number;
  /** Gauge resolution, Pa (0 when readings are not rounded). */
  gaugeResolution: number;
  /** Sample interval, s. */
  sampleInterval: number;
  /** Pressure rise per sample while loading: stiffness x rate x interval, Pa. */
  loadingRisePerSample: number;
  /** Leak-off: breakdown minus leak-off, the span over which the fracture's share of the rate grows (generate.ts), Pa. */
  leakOffSpan: number;
  /** Reopening: propagation minus reopening of the cycle (generate.ts), Pa. */
  reopeningSpan: number;
  /** Set ISIP minus set closure of the cycle (the decline before closure), Pa. */
  declineToClosure: number;
  /** Closure time after shut-in, s (for a leaking shut-in). */
  closureDelay: number;
  /** Extra decline of a leaking shut-in, Pa/s (0 when tight). */
  leakRate: number;
  /** Pressure rise of the cycle while pumping (set peak minus the starting level), Pa. */
  cycleRise: number;
  /** Rate wandering (the unsteady-rate flaw). */
  unsteadyRate: boolean;
  /** SRT: set extension pressure minus pore pressure, Pa (0 for other tests). */
  extensionAbovePorePressure: number;
}

/** Standard deviation of one reading: noise plus rounding to the resolution (uniform, SD r/sqrt 12). */
export function readingSd(t: ToleranceInput): number {
  return Math.hypot(t.noiseSd, t.gaugeResolution / Math.sqrt(12));
}

/**
 * Allowed |pick - truth| for one pick kind, Pa.
 *
 * - leakOff: the generator lets the fracture take 0.8 (p - PLO)/span of the rate above the
 *   leak-off PLO, so below the loading line the pressure lags by about 0.4 D^2/span after a
 *   further rise D; that first exceeds the engine's departure threshold of 3 SD at
 *   D = sqrt(3 SD span / 0.4). The pick is then moved back by up to 4 samples (the centred
 *   mean residual of loading-picks.ts), each one loading rise apart: 4 rises more. A wandering
 *   rate (+-25 %) makes the rise per sample up to 25 % larger.
 * - reopening: later cycles take q sqrt((p - Pr)/span): the lag grows as (2/3) D^1.5/sqrt(span),
 *   so D = (1.5 x 3 SD sqrt(span))^(2/3), plus the same 4 samples.
 * - breakdown, fitMaximum: the peak is the highest sample, so the true peak lies within one
 *   sample's rise of it, and noise moves that sample by up to 3 SD.
 * - propagation: the plateau is the end of pumping within a band of max(3 SD, 0.5 % of the
 *   cycle's rise) (loading-picks.ts); its median lies within twice that band of the set level.
 * - isip: an early-decline extrapolation over the skipped first seconds: 0.03 MPa plus 5 SD
 *   (common practice precision of an ISIP pick); at 5 s sampling or coarser the skip covers
 *   30 s or more of the fastest decline, so 5 % of the decline to closure more.
 * - closure: derivative methods pick where a slope changes, so the pressure error is the
 *   decline rate times a timing error: 5 % of the decline to closure (the tolerance of the
 *   shut-in method tests) plus 0.03 MPa, plus 10 SD because differentiation amplifies noise;
 *   a leaking shut-in lowers the recorded pressure at the true closure time by leak x delay
 *   and tilts the decline so the departure shows later (a quarter more); at 5 s sampling or
 *   coarser a derivative window of at least 12 samples spans minutes of a few-minute decline,
 *   so 15 % of the decline more.
 * - extension: two straight lines through stabilised steps: 0.05 MPa plus 5 SD. A rate
 *   wandering by 25 % (period 45 s) moves every step's end pressure: the step responds with a
 *   40 s time constant (generate.ts), which passes 1/sqrt(1 + (2 pi 40/45)^2) = 18 % of the
 *   swing, i.e. 0.25 x 0.18 of the step's pressure above pore pressure, up to the extension;
 *   a line through about 4 such steps halves that.
 */
export function pickTolerance(kind: PickKind, t: ToleranceInput): number {
  const sd = readingSd(t);
  const rise = t.loadingRisePerSample * (t.unsteadyRate ? 1.25 : 1);
  const coarse = t.sampleInterval >= 5;
  switch (kind) {
    case 'leakOff':
      return Math.sqrt((3 * sd * t.leakOffSpan) / 0.4) + 4 * rise;
    case 'reopening':
      return (1.5 * 3 * sd * Math.sqrt(t.reopeningSpan)) ** (2 / 3) + 4 * rise;
    case 'breakdown':
    case 'fitMaximum':
      return rise + 3 * sd + t.gaugeResolution;
    case 'propagation':
      return 2 * Math.max(3 * sd, 0.005 * t.cycleRise);
    case 'isip':
      return 0.03e6 + 5 * sd + (coarse ? 0.05 * t.declineToClosure : 0);
    case 'closure':
      return 0.03e6 + 0.05 * t.declineToClosure + 10 * sd + 1.25 * t.leakRate * t.closureDelay + (coarse ? 0.15 * t.declineToClosure : 0);
    case 'extension':
      return 0.05e6 + 5 * sd + (t.unsteadyRate ? (0.25 * 0.18 * t.extensionAbovePorePressure) / 2 : 0);
  }
}

/**
 * Analytic test records whose truth is set here: piecewise pressure histories built from
 * straight lines, parabolas and exponentials, sampled at a fixed interval, with optional
 * seeded Gaussian noise. Pressures are at the tested depth (downhole gauge) unless stated.
 */
import type { TestMetadata, TestRecord } from '../../../src-renderer/engine/record';
import { seededRandom } from '../../../src-renderer/engine/synthetic/random';

/** One phase of the history: duration (s), pump rate (m3/s) and pressure as a function of phase time. */
export interface Phase {
  duration: number;
  rate: number;
  pressure: (t: number, startPressure: number) => number;
}

/** Deterministic standard normal numbers from the engine's seeded generator (mulberry32). */
export function normalSource(seed: number): () => number {
  const random = seededRandom(seed);
  return () => random.normal();
}

/** Builds a record from phases; `noise` Pa SD on pressure; rate noise as a fraction. */
export function recordFromPhases(
  phases: Phase[],
  options: { interval?: number; noise?: number; rateNoise?: number; seed?: number; metadata?: Partial<TestMetadata>; p0?: number } = {},
): TestRecord {
  const dt = options.interval ?? 1;
  const total = phases.reduce((s, p) => s + p.duration, 0);
  const n = Math.round(total / dt) + 1;
  const time = new Float64Array(n);
  const pressure = new Float64Array(n);
  const rate = new Float64Array(n);
  const volume = new Float64Array(n);
  const normal = normalSource(options.seed ?? 7);
  let phase = 0;
  let phaseStart = 0;
  let startPressure = options.p0 ?? 0;
  for (let i = 0; i < n; i++) {
    const t = i * dt;
    while (phase < phases.length - 1 && t >= phaseStart + phases[phase].duration - 1e-9) {
      startPressure = phases[phase].pressure(phases[phase].duration, startPressure);
      phaseStart += phases[phase].duration;
      phase++;
    }
    const ph = phases[phase];
    time[i] = t;
    const q = ph.rate;
    rate[i] = q * (1 + (options.rateNoise ?? 0) * (q !== 0 ? normal() : 0));
    pressure[i] = ph.pressure(t - phaseStart, startPressure) + (options.noise ?? 0) * normal();
    volume[i] = i === 0 ? 0 : volume[i - 1] + q * dt;
  }
  return {
    time, pressure, rate, volume,
    metadata: { gaugePosition: 'downhole', ...(options.metadata ?? {}) } as TestMetadata,
    source: { fileName: 'analytic.csv', format: 'synthetic', layout: 'analytic', columns: [], derived: { rate: false, volume: true }, warnings: [] },
  };
}

/** Parameters of a leak-off cycle: straight loading, parabolic bend, optional breakdown and plateau. */
export interface LoadingShape {
  /** Pressure rise per second while loading, Pa/s. */
  slope: number;
  /** Time of the leak-off (end of the straight part), s from pump start. */
  leakOffTime: number;
  /** Time of the peak after leak-off, s from pump start (the parabola's vertex). */
  peakTime: number;
  /** Pumping duration, s. */
  pumpDuration: number;
  /** With breakdown: propagation pressure after the drop, Pa (absolute). Without: the parabola holds at the peak. */
  propagation?: number;
  rate: number;
}

/** Pressure of a pumping phase with the shape above, from startPressure. */
export function loadingPhase(shape: LoadingShape): Phase {
  return {
    duration: shape.pumpDuration,
    rate: shape.rate,
    pressure: (t, p0) => {
      const { slope, leakOffTime: tl, peakTime: tb } = shape;
      if (t <= tl) return p0 + slope * t;
      const a = slope / (2 * (tb - tl));
      const tt = Math.min(t, tb);
      const bend = p0 + slope * tt - a * (tt - tl) ** 2;
      if (t <= tb || shape.propagation === undefined) return bend;
      return shape.propagation + (bend - shape.propagation) * Math.exp(-(t - tb) / 5);
    },
  };
}

/** Leak-off pressure of a loading phase started at p0. */
export function leakOffPressure(shape: LoadingShape, p0: number): number {
  return p0 + shape.slope * shape.leakOffTime;
}

/** Peak pressure of a loading phase started at p0. */
export function peakPressure(shape: LoadingShape, p0: number): number {
  const a = shape.slope / (2 * (shape.peakTime - shape.leakOffTime));
  return p0 + shape.slope * shape.peakTime - a * (shape.peakTime - shape.leakOffTime) ** 2;
}

/** Shut-in: an instant drop of `drop` Pa, then exponential decay towards `floor` with time constant tau (s). */
export function shutInPhase(duration: number, drop: number, floor: number, tau: number): Phase {
  return {
    duration,
    rate: 0,
    pressure: (t, p0) => floor + (p0 - drop - floor) * Math.exp(-t / tau),
  };
}

/** A constant-pressure idle phase (no pumping). */
export function idlePhase(duration: number): Phase {
  return { duration, rate: 0, pressure: (_t, p0) => p0 };
}

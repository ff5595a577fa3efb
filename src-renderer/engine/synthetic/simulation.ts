/**
 * The time-stepping pieces of the synthetic generator (generate.ts): a trace on a fine
 * 0.1 s grid of downhole pressure, true rate and cumulative volume, and the phases a test is
 * made of (pumping against the system stiffness, holding, shut-in, flow-back).
 */
import { gFunction } from '../analysis/gfunction';
import { EngineError } from '../errors';
import type { RandomSource } from './random';
import type { SyntheticSpec } from './spec';

/** Fine time step of the simulation, s; the record samples it at spec.sampleInterval. */
export const STEP = 0.1;
const MAX_PHASE_SECONDS = 7200;

/** The growing record on the fine grid: time (s), downhole pressure (Pa), true rate (m3/s), cumulative volume (m3). */
export class Trace {
  readonly t: number[] = [];
  readonly p: number[] = [];
  readonly q: number[] = [];
  readonly v: number[] = [];
  time = 0;
  pressure: number;
  volume = 0;
  constructor(start: number) { this.pressure = start; this.push(0); }
  push(rate: number): void { this.t.push(this.time); this.p.push(this.pressure); this.q.push(rate); this.v.push(this.volume); }
  advance(rate: number, pressure: number): void {
    this.time = Math.round((this.time + STEP) * 10) / 10;
    this.volume += rate * STEP;
    this.pressure = pressure;
    this.push(rate);
  }
}

export interface Pumping {
  rate: (time: number) => number;
  stiffness: number;
  toeVolume: number;
}

/**
 * Pump until `stop` says so: dP/dt = K (1 - exp(-v/toe)) (q - q_fracture(P)).
 * @param trace the trace to extend. @param pumping rate (m3/s), stiffness (Pa/m3), toe volume (m3).
 * @param fractureRate rate taken by the fracture at pressure P, m3/s. @param stop end condition on P (Pa) and elapsed s.
 * @throws EngineError 'bad-argument' after two hours without reaching the stop condition.
 * @example pump(trace, pumping, () => 0, (p) => p >= 30e6)
 */
export function pump(trace: Trace, pumping: Pumping, fractureRate: (p: number, q: number) => number, stop: (p: number, elapsed: number) => boolean): void {
  const start = trace.time;
  const startVolume = trace.volume;
  for (;;) {
    const elapsed = trace.time - start;
    if (stop(trace.pressure, elapsed)) return;
    if (elapsed > MAX_PHASE_SECONDS) throw new EngineError('bad-argument', 'the set pressures are not reached within two hours of pumping', {}, 'reachable event pressures');
    const q = pumping.rate(trace.time);
    const cycleVolume = trace.volume - startVolume;
    const k = pumping.stiffness * (1 - Math.exp(-cycleVolume / pumping.toeVolume));
    const next = trace.pressure + k * (q - fractureRate(trace.pressure, q)) * STEP;
    trace.advance(q, next);
  }
}

/**
 * Extend the trace for `duration` s with pressure given by `pressureAt(dt)` (Pa) at a fixed rate (m3/s).
 * @throws nothing. @example hold(trace, 30, () => 20e6)
 */
export function hold(trace: Trace, duration: number, pressureAt: (dt: number) => number, rate = 0): void {
  const start = trace.time;
  const steps = Math.round(duration / STEP);
  for (let i = 1; i <= steps; i++) trace.advance(rate, pressureAt(trace.time + STEP - start));
}

export interface ShutInShape {
  stopPressure: number;
  isip: number;
  closure: number;
  pumpTime: number;
  closureTime: number;
  relaxation: number;
  duration: number;
  leakRate: number;
}

/**
 * Shut-in (throws nothing; example: shutIn(trace, shape)): friction drop to ISIP (1 s time constant), decline linear in G down to closure,
 * then a decline that relaxes in real time with `relaxation` seconds, starting with the
 * pre-closure rate (so dP/dG falls off after closure and the pressure settles).
 */
export function shutIn(trace: Trace, shape: ShutInShape): { isipTime: number; closureTime: number } {
  const gClosure = gFunction(shape.closureTime);
  const slope = (shape.isip - shape.closure) / gClosure;
  const closureDt = shape.closureTime * shape.pumpTime;
  const step = 1e-3 * shape.pumpTime;
  const gRate = (gClosure - gFunction(shape.closureTime - 1e-3)) / step;
  const drop = slope * gRate * shape.relaxation;
  const start = trace.time;
  hold(trace, shape.duration, (dt) => {
    const base = dt <= closureDt
      ? shape.isip - slope * gFunction(dt / shape.pumpTime)
      : shape.closure - drop * (1 - Math.exp(-(dt - closureDt) / shape.relaxation));
    return base + (shape.stopPressure - shape.isip) * Math.exp(-dt / 1.0) - shape.leakRate * dt;
  });
  return { isipTime: start + 5, closureTime: start + closureDt };
}

/**
 * Flow back at twice the pump rate for 60 s, pressure relaxing to `target` (Pa, 12 s time constant), then 30 s still.
 * @throws nothing. @example flowBack(trace, 23.5e6, 1.3e-3)
 */
export function flowBack(trace: Trace, target: number, rate: number): void {
  const from = trace.pressure;
  hold(trace, 60, (dt) => target + (from - target) * Math.exp(-dt / 12), -2 * rate);
  hold(trace, 30, () => target);
}

/**
 * The pump rate against time, m3/s: constant, or wandering 25 % sinusoidally (period 45 s) for an unsteady rate.
 * @throws nothing. @example rateFunction(spec, 1.3e-3, random)(10)
 */
export function rateFunction(spec: SyntheticSpec, base: number, random: RandomSource): (t: number) => number {
  if (!spec.flaws?.unsteadyRate) return () => base;
  const phase = random.uniform() * 2 * Math.PI;
  return (t) => base * (1 + 0.25 * Math.sin((2 * Math.PI * t) / 45 + phase));
}


/**
 * Synthetic pressure-test records whose truth the caller sets: FIT, LOT, XLOT (2-4
 * cycles), SRT and DFIT. Physics-light but consistent:
 * - loading at rate q with stiffness K = 1/(c V) (METHODS.md "System stiffness"), a small
 *   initial toe, dP/dt = K (q - q_fracture);
 * - leak-off: above the set leak-off pressure fluid enters the fracture at a rate growing
 *   with pressure, so the pressure rises more slowly until breakdown;
 * - breakdown peak and drop to a propagation plateau while pumping goes on;
 * - shut-in: a short friction drop to the set ISIP, then a decline linear in Nolte's
 *   G-function (Nolte 1979, SPE 8341) down to the set closure, after which dP/dG falls
 *   off (the decline slows), so G dP/dG tangent and compliance picks find closure;
 * - later cycles reopen at the set reopening pressure and rise to the plateau;
 * - step-rate: stabilising steps on a matrix line and a fracture line meeting at the set
 *   extension pressure (two-line model of METHODS.md "Step-rate test").
 * Flaws and the gauge (surface or downhole, with the mud column rho g TVD between them,
 * noise, resolution, range) are applied last. Deterministic for a given seed.
 */
import { EngineError } from '../errors';
import type { TestMetadata, TestRecord } from '../record';
import type { CubicMetre, KilogramPerCubicMetre, Metre, Pascal, PerPascal } from '../units/quantity';
import { STANDARD_GRAVITY } from '../units/quantity';
import { seededRandom } from './random';
import type { RandomSource } from './random';
import { flowBack, hold, pump, rateFunction, shutIn, STEP, Trace, type Pumping } from './simulation';
import type { SyntheticSpec, SyntheticTruth, TruthCycle } from './spec';

const PSI = 6894.757293168361;
const BARREL_PER_MINUTE = 0.158987294928 / 60;

/** The event pressures a spec implies, with defaults derived from Shmin (Pa, downhole). */
export interface EventPressures {
  hydrostatic: number;
  porePressure: number;
  closure: number;
  isip: number;
  propagation: number;
  reopening: number;
  leakOff: number;
  breakdown: number;
  fitPressure: number;
  extension: number;
}

/**
 * Event pressures of a spec, defaults from Shmin: ISIP Shmin + 0.5 MPa, reopening + 0.8,
 * propagation + 1.2, leak-off + 1.5 (LOT + 0.6), breakdown + 4.8 (T0 = 4 MPa), FIT 80 % of
 * the way from the mud column to leak-off, extension + 0.3 MPa.
 *
 * @param spec the synthetic spec (SI). @returns pressures at depth, Pa.
 * @throws EngineError 'bad-argument' when the events are not ordered above the mud column.
 * @example eventPressures({type: 'xlot', depthTvd: 2000, shmin: 34e6}).breakdown // 38.8e6
 */
export function eventPressures(spec: SyntheticSpec): EventPressures {
  const rho = spec.mudDensity ?? (spec.type === 'srt' ? 1000 : 1200);
  const hydrostatic = rho * STANDARD_GRAVITY * spec.depthTvd;
  const porePressure = spec.porePressure ?? 10.0e3 * spec.depthTvd;
  const s = spec.shmin;
  const leakOff = spec.leakOff ?? s + (spec.type === 'lot' ? 0.6e6 : 1.5e6);
  const out: EventPressures = {
    hydrostatic,
    porePressure,
    closure: s,
    isip: spec.isip ?? s + 0.5e6,
    propagation: spec.propagation ?? s + 1.2e6,
    reopening: spec.reopening ?? s + 0.8e6,
    leakOff,
    breakdown: spec.breakdown ?? s + 4.8e6,
    fitPressure: spec.fitPressure ?? hydrostatic + 0.8 * (leakOff - hydrostatic),
    extension: spec.extensionPressure ?? s + 0.3e6,
  };
  if (spec.type !== 'srt' && !(s > hydrostatic + 0.5e6)) {
    throw new EngineError('bad-argument', `Shmin ${(s / 1e6).toFixed(2)} MPa is not above the mud column ${(hydrostatic / 1e6).toFixed(2)} MPa by 0.5 MPa`, {}, 'a lighter mud or a higher Shmin');
  }
  if (spec.type === 'srt' && !(out.extension > porePressure && porePressure >= hydrostatic)) {
    throw new EngineError('bad-argument', 'a step-rate test needs pore pressure at or above the fluid column and extension above pore pressure', {}, 'Pp >= rho g TVD and extension > Pp');
  }
  if (!(out.breakdown > out.leakOff && out.leakOff > out.closure && out.propagation > out.closure && out.isip > out.closure)) {
    throw new EngineError('bad-argument', 'event pressures must be ordered: closure below ISIP and propagation, leak-off below breakdown', {}, 'closure < ISIP, propagation, leak-off < breakdown');
  }
  return out;
}

/**
 * Generate a synthetic test record and its truth.
 *
 * @param spec the test to build (SI); see SyntheticSpec for ranges and defaults.
 * @returns {record, truth}: record in the importer's normalised SI form (gauge pressure,
 *   Pa; rate m3/s; cumulative volume m3) with metadata; truth with every set event.
 * @throws EngineError 'bad-argument' for inconsistent or unreachable event pressures,
 *   a non-positive depth, rate, volume or compressibility, or an XLOT cycle count outside 2-4.
 * @example generateSyntheticTest({type: 'lot', depthTvd: 1500, shmin: 25.75e6}).truth.cycles[0].picks.leakOff
 */
export function generateSyntheticTest(spec: SyntheticSpec): { record: TestRecord; truth: SyntheticTruth } {
  for (const [name, value] of [['depthTvd', spec.depthTvd], ['shmin', spec.shmin]] as const) {
    if (!Number.isFinite(value) || value <= 0) throw new EngineError('bad-argument', `${name} must be a positive number`, {}, `a positive ${name}`);
  }
  const seed = spec.seed ?? 1;
  const random = seededRandom(seed);
  const events = eventPressures(spec);
  const rate = spec.rate ?? 0.5 * BARREL_PER_MINUTE;
  const volume = spec.systemVolume ?? 60;
  const compressibility = spec.compressibility ?? 6e-10;
  if (!(rate > 0 && volume > 0 && compressibility > 0)) throw new EngineError('bad-argument', 'rate, system volume and compressibility must be positive', {}, 'positive values');
  const expectedSlope = 1 / (compressibility * volume);
  const air = spec.flaws?.airInLine ?? false;
  const stiffness = air ? 0.45 * expectedSlope : expectedSlope;
  const pumping: Pumping = { rate: rateFunction(spec, rate, random), stiffness, toeVolume: air ? 0.25 : 0.004 };
  const leakRate = spec.flaws?.leakingShutIn ? (spec.leakRate ?? 40e3 / 60) : 0;
  const shutInDuration = spec.shutInDuration ?? (spec.type === 'dfit' ? 3600 : 900);
  const closureTime = spec.closureTime ?? (spec.type === 'dfit' ? 1.0 : spec.type === 'srt' ? 0.2 : 0.5);
  const relaxation = spec.type === 'dfit' ? 600 : 60;
  const start = spec.type === 'srt' ? events.porePressure : events.hydrostatic;
  const trace = new Trace(start);
  const cycles: TruthCycle[] = [];
  hold(trace, 30, () => start);

  const standardShutIn = (pumpStart: number, isip: number, duration = shutInDuration) => shutIn(trace, {
    stopPressure: trace.pressure, isip, closure: events.closure, pumpTime: trace.time - pumpStart,
    closureTime, relaxation, duration, leakRate,
  });

  if (spec.type === 'fit') {
    const pumpStart = trace.time;
    pump(trace, pumping, () => 0, (p) => p >= events.fitPressure);
    const pumpEnd = trace.time;
    const top = trace.pressure;
    hold(trace, shutInDuration, (dt) => top - 0.05e6 * (1 - Math.exp(-dt / 2)) - 0.15e6 * (1 - Math.exp(-dt / 120)) - leakRate * dt);
    cycles.push({ index: 1, pumpStartTime: pumpStart, pumpEndTime: pumpEnd, shutInEndTime: trace.time, picks: { fitMaximum: { pressure: top, time: pumpEnd } } });
    if (spec.flowBack) flowBack(trace, start, rate);
  } else if (spec.type === 'srt') {
    simulateStepRate(trace, spec, events, rate, cycles, (pumpStart, isip) => standardShutIn(pumpStart, isip));
    if (spec.flowBack) flowBack(trace, start, rate);
  } else {
    const count = spec.type === 'xlot' ? spec.cycles ?? 2 : 1;
    if (spec.type === 'xlot' && !(Number.isInteger(count) && count >= 2 && count <= 4)) {
      throw new EngineError('bad-argument', `an XLOT has 2 to 4 cycles, not ${count}`, {}, '2, 3 or 4 cycles');
    }
    for (let n = 1; n <= count; n++) {
      const pumpStart = trace.time;
      const picks: TruthCycle['picks'] = {};
      const bad = n === 2 ? spec.flaws?.badSecondCycle : undefined;
      if (n === 1) {
        const lo = events.leakOff;
        const span = events.breakdown - lo;
        const fracture = (p: number, q: number) => (p <= lo ? 0 : q * 0.8 * Math.min(1, (p - lo) / span));
        pump(trace, pumping, () => 0, (p) => p >= lo);
        picks.leakOff = { pressure: lo, time: trace.time };
        if (spec.type === 'lot') {
          const stop = lo + 0.35 * span;
          pump(trace, pumping, fracture, (p) => p >= stop);
        } else {
          pump(trace, pumping, fracture, (p) => p >= events.breakdown);
          picks.breakdown = { pressure: events.breakdown, time: trace.time };
          const peak = trace.pressure;
          const plateau = spec.type === 'dfit' ? 240 : 90;
          const t0 = trace.time;
          hold(trace, plateau, (dt) => events.propagation + (peak - events.propagation) * Math.exp(-dt / 6), rate);
          // the hold keeps the recorded rate at the base rate; the volume grows as pumped
          picks.propagation = { pressure: events.propagation, time: t0 + plateau * 0.75 };
        }
      } else {
        const pr = bad === 'reopening-above-breakdown' ? events.breakdown + 0.5e6 : events.reopening;
        const plateauPressure = bad === 'reopening-above-breakdown' ? events.breakdown + 1.0e6 : events.propagation;
        pump(trace, pumping, () => 0, (p) => p >= pr);
        picks.reopening = { pressure: pr, time: trace.time };
        const span = plateauPressure - pr;
        pump(trace, pumping, (p, q) => (p <= pr ? 0 : q * Math.sqrt(Math.min(1, (p - pr) / span))), (_p, elapsed) => elapsed >= 90);
        picks.propagation = { pressure: plateauPressure, time: trace.time - 10 };
      }
      const pumpEnd = trace.time;
      const isip = spec.type === 'lot' ? spec.isip ?? trace.pressure - 0.15e6 : events.isip;
      const shortShutIn = bad === 'no-stable-shut-in';
      const times = standardShutIn(pumpStart, isip, shortShutIn ? 90 : shutInDuration);
      picks.isip = { pressure: isip, time: times.isipTime };
      if (!shortShutIn && times.closureTime <= trace.time) picks.closure = { pressure: events.closure, time: times.closureTime };
      cycles.push({ index: n, pumpStartTime: pumpStart, pumpEndTime: pumpEnd, shutInEndTime: trace.time, picks });
      if (n < count || spec.flowBack) flowBack(trace, start, rate);
    }
  }
  return buildRecord(spec, trace, events, cycles, { seed, random, expectedSlope, stiffness, rate, volume, compressibility });
}

function simulateStepRate(
  trace: Trace, spec: SyntheticSpec, events: EventPressures, increment: number, cycles: TruthCycle[],
  shut: (pumpStart: number, isip: number) => { isipTime: number; closureTime: number },
): void {
  const steps = spec.steps ?? 8;
  const duration = spec.stepDuration ?? 240;
  if (!(Number.isInteger(steps) && steps >= 4)) throw new EngineError('bad-argument', `a step-rate test needs at least 4 steps, not ${steps}`, {}, '4 or more steps');
  const breakRate = (Math.floor(steps / 2) + 0.5) * increment;
  const matrixInjectivity = breakRate / (events.extension - events.porePressure);
  const fractureInjectivity = 5 * matrixInjectivity;
  const stabilised = (q: number) => (q <= breakRate ? events.porePressure + q / matrixInjectivity : events.extension + (q - breakRate) / fractureInjectivity);
  const pumpStart = trace.time;
  let extensionTime = 0;
  const wobble = spec.flaws?.unsteadyRate ? (t: number) => 1 + 0.25 * Math.sin((2 * Math.PI * t) / 45) : () => 1;
  for (let k = 1; k <= steps; k++) {
    const q = k * increment;
    const target = stabilised(q);
    const n = Math.round(duration / STEP);
    for (let i = 0; i < n; i++) trace.advance(q * wobble(trace.time), trace.pressure + (target - trace.pressure) * (1 - Math.exp(-STEP / 40)));
    if (extensionTime === 0 && q > breakRate) extensionTime = trace.time;
  }
  const isip = spec.isip ?? Math.max(events.closure + 0.5e6, Math.min(trace.pressure - 0.1e6, events.extension + 0.2e6));
  const times = shut(pumpStart, isip);
  const picks: TruthCycle['picks'] = {
    extension: { pressure: events.extension, time: extensionTime, rate: breakRate },
    isip: { pressure: isip, time: times.isipTime },
  };
  if (times.closureTime <= trace.time) picks.closure = { pressure: events.closure, time: times.closureTime };
  cycles.push({ index: 1, pumpStartTime: pumpStart, pumpEndTime: pumpStart + steps * duration, shutInEndTime: trace.time, picks });
}

function buildRecord(
  spec: SyntheticSpec, trace: Trace, events: EventPressures, cycles: TruthCycle[],
  k: { seed: number; random: RandomSource; expectedSlope: number; stiffness: number; rate: number; volume: number; compressibility: number },
): { record: TestRecord; truth: SyntheticTruth } {
  const interval = spec.sampleInterval ?? 1;
  if (!(interval >= STEP)) throw new EngineError('bad-argument', `sample interval ${interval} s is below ${STEP} s`, {}, `an interval of at least ${STEP} s`);
  const position = spec.gaugePosition ?? 'surface';
  const offset = position === 'surface' ? events.hydrostatic : 0;
  const stride = Math.max(1, Math.round(interval / STEP));
  const count = Math.floor((trace.t.length - 1) / stride) + 1;
  let range = spec.gaugeRange ?? (position === 'surface' ? 10000 * PSI : 15000 * PSI);
  if (spec.flaws?.clippedGauge) {
    let peak = -Infinity;
    for (const p of trace.p) peak = Math.max(peak, p);
    const reference = spec.type === 'xlot' || spec.type === 'dfit' ? events.propagation : peak - 0.1 * (peak - events.closure);
    range = Math.round(reference - offset + 0.6 * (peak - reference)) || range;
  }
  const time = new Float64Array(count);
  const pressure = new Float64Array(count);
  const rateOut = new Float64Array(count);
  const volumeOut = new Float64Array(count);
  const noise = spec.noiseSd ?? 3e3;
  const resolution = spec.gaugeResolution;
  for (let i = 0; i < count; i++) {
    const j = i * stride;
    time[i] = trace.t[j];
    let g = trace.p[j] - offset + noise * k.random.normal();
    g = Math.min(g, range);
    if (resolution && resolution > 0) g = Math.round(g / resolution) * resolution;
    pressure[i] = g;
    rateOut[i] = trace.q[j] === 0 ? 0 : trace.q[j] * (1 + 0.005 * k.random.normal());
    volumeOut[i] = trace.v[j];
  }
  const metadata: TestMetadata = {
    field: 'Harrow Flats',
    contractor: 'Cobalt Ridge Test Services',
    testType: spec.type,
    depthTvd: spec.depthTvd as Metre,
    depthMd: spec.depthTvd as Metre,
    mudDensity: (spec.mudDensity ?? (spec.type === 'srt' ? 1000 : 1200)) as KilogramPerCubicMetre,
    gaugePosition: position,
    gaugeRange: range as Pascal,
    ...(resolution ? { gaugeResolution: resolution as Pascal } : {}),
    ...(spec.includeSystemMetadata === false ? {} : { systemVolume: k.volume as CubicMetre, compressibility: k.compressibility as PerPascal }),
    ...(spec.porePressure !== undefined ? { porePressure: spec.porePressure as Pascal } : {}),
    ...(spec.verticalStress !== undefined ? { verticalStress: spec.verticalStress as Pascal } : {}),
    ...spec.metadata,
  };
  const record: TestRecord = {
    time, pressure, rate: rateOut, volume: volumeOut, metadata,
    source: {
      fileName: spec.fileName ?? `synthetic-${spec.type}-${k.seed}`,
      format: 'synthetic',
      layout: 'synthetic',
      columns: [
        { index: 0, header: 'time', role: 'time', unit: 's', unitStated: true },
        { index: 1, header: 'pressure', role: 'pressure', unit: 'Pa', unitStated: true },
        { index: 2, header: 'rate', role: 'rate', unit: 'm3/s', unitStated: true },
        { index: 3, header: 'volume', role: 'volume', unit: 'm3', unitStated: true },
      ],
      derived: { rate: false, volume: false },
      warnings: [],
    },
  };
  const first = cycles[0];
  const later = cycles.find((c) => c.index >= 2 && c.picks.reopening);
  const truth: SyntheticTruth = {
    type: spec.type,
    seed: k.seed,
    shmin: spec.shmin,
    porePressure: events.porePressure,
    ...(spec.verticalStress !== undefined ? { verticalStress: spec.verticalStress } : {}),
    hydrostatic: events.hydrostatic,
    expectedSlope: k.expectedSlope,
    loadingSlope: k.stiffness,
    gaugeRange: range,
    cycles,
    flaws: { ...spec.flaws },
  };
  if (later?.picks.reopening && first?.picks.breakdown) {
    truth.shmax = 3 * spec.shmin - later.picks.reopening.pressure - events.porePressure;
    truth.tensileStrength = first.picks.breakdown.pressure - later.picks.reopening.pressure;
  }
  return { record, truth };
}

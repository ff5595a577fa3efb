/**
 * The app's own visual vocabulary for picks, grades, review states and criteria.
 * Colour is never the only carrier: every pick kind has its own marker shape and
 * short label, every grade a bar meter and its letter, every state a glyph and words.
 * Hues are chosen to stay distinct under the common colour-vision deficiencies
 * (blue / orange / purple / dark teal / ochre, varied lightness).
 */
import type { Grade, PickKind } from '../../engine/result';
import type { ReviewState } from '../../archive/events';

/** ECharts built-in symbol names, or a path. */
const CROSS = 'path://M2,0 L5,3 L8,0 L10,2 L7,5 L10,8 L8,10 L5,7 L2,10 L0,8 L3,5 L0,2 Z';
const STAR = 'path://M5,0 L6.2,3.6 L10,3.8 L7,6.1 L8.1,10 L5,7.8 L1.9,10 L3,6.1 L0,3.8 L3.8,3.6 Z';
const HOURGLASS = 'path://M0,0 L10,0 L5,5 L10,10 L0,10 L5,5 Z';
const DOWN_TRIANGLE = 'path://M0,0 L10,0 L5,9 Z';

export interface PickStyle {
  /** Short label drawn beside the marker. */
  short: string;
  /** Plain-English name. */
  name: string;
  symbol: string;
  rotate: number;
  color: string;
  size: number;
}

export const PICK_STYLE: Record<PickKind, PickStyle> = {
  leakOff: { short: 'LOP', name: 'Leak-off point', symbol: 'diamond', rotate: 0, color: '#0b5f8f', size: 15 },
  breakdown: { short: 'FBP', name: 'Breakdown (peak)', symbol: 'triangle', rotate: 0, color: '#b4530f', size: 15 },
  propagation: { short: 'FPP', name: 'Propagation pressure', symbol: 'rect', rotate: 0, color: '#555f6d', size: 11 },
  isip: { short: 'ISIP', name: 'Instantaneous shut-in pressure', symbol: 'circle', rotate: 0, color: '#6a3d9a', size: 13 },
  closure: { short: 'FCP', name: 'Closure', symbol: CROSS, rotate: 0, color: '#0f7669', size: 14 },
  reopening: { short: 'Pr', name: 'Reopening', symbol: DOWN_TRIANGLE, rotate: 0, color: '#9c6b00', size: 14 },
  fitMaximum: { short: 'FIT', name: 'FIT maximum (limit reached)', symbol: HOURGLASS, rotate: 0, color: '#3d4b5c', size: 13 },
  extension: { short: 'Pext', name: 'Extension pressure', symbol: STAR, rotate: 0, color: '#a23b72', size: 17 },
};

/** Order in which picks are listed (follows the pumping sequence). */
export const PICK_ORDER: PickKind[] = ['fitMaximum', 'leakOff', 'breakdown', 'propagation', 'extension', 'isip', 'closure', 'reopening'];

/** Grades on a single blue-to-ochre ramp (lightness falls off towards E) plus a 0-4 bar meter. */
export const GRADE_STYLE: Record<Grade, { color: string; bars: number; words: string }> = {
  A: { color: '#1d4e89', bars: 4, words: 'reliable' },
  B: { color: '#3b7197', bars: 3, words: 'usable' },
  C: { color: '#6c7683', bars: 2, words: 'use with care' },
  D: { color: '#9a6a1f', bars: 1, words: 'weak' },
  E: { color: '#7f3f0f', bars: 0, words: 'not usable' },
};

export const STATE_STYLE: Record<ReviewState, { words: string; glyph: string; color: string }> = {
  imported: { words: 'Imported', glyph: '○', color: '#4a5563' },
  'in-review': { words: 'In review', glyph: '◐', color: '#1d4e89' },
  accepted: { words: 'Accepted', glyph: '✔', color: '#0f6657' },
  rejected: { words: 'Rejected', glyph: '✕', color: '#8a3b12' },
};

export const CRITERION_STYLE = {
  pass: { words: 'Pass', glyph: '✓', color: '#0f6657' },
  fail: { words: 'Fail', glyph: '✗', color: '#8a3b12' },
  unknown: { words: 'Cannot judge', glyph: '?', color: '#5b6472' },
} as const;

/** Series colours of the charts. */
export const SERIES_COLOR = {
  downhole: '#1d3f73',
  gauge: '#8a97a8',
  rate: '#c26a12',
  volume: '#6b4c9a',
  fit: '#0f7669',
  derivative: '#b4530f',
  tangent: '#555f6d',
};

/** Colours and dash patterns for overlaid cycles (dash varies too, so cycles stay apart without colour). */
export const CYCLE_STYLE: { color: string; dash: 'solid' | 'dashed' | 'dotted' | number[] }[] = [
  { color: '#1d3f73', dash: 'solid' },
  { color: '#c26a12', dash: 'dashed' },
  { color: '#0f7669', dash: 'dotted' },
  { color: '#6a3d9a', dash: [8, 3, 2, 3] },
  { color: '#9c6b00', dash: [2, 2] },
  { color: '#555f6d', dash: [12, 4] },
];

export function cycleStyle(index: number): { color: string; dash: 'solid' | 'dashed' | 'dotted' | number[] } {
  return CYCLE_STYLE[(index - 1 + CYCLE_STYLE.length) % CYCLE_STYLE.length];
}

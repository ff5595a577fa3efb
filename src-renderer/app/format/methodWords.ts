/**
 * Plain words for the engine's pick method ids ("g-dpdg-tangent", ...). The ids stay in
 * exports and the review log; the screens show these words (with the id as a tooltip).
 */
const METHOD_WORDS: Record<string, string> = {
  'departure-from-linear-loading': 'departure from the straight loading line',
  'departure-from-linear-reloading': 'departure from the straight reloading line',
  'pumping-peak-before-drop': 'peak pressure before the drop',
  'median-of-pumping-plateau': 'median of the pumping plateau',
  'maximum-pumping-pressure': 'highest pumping pressure',
  'early-decline-extrapolation': 'early shut-in decline extended back to shut-in',
  'g-dpdg-tangent': 'G-function, G dP/dG leaves the line through the origin',
  'sqrt-time': 'square root of time, end of the straight part',
  'bilinear-dpdt': 'corner between two straight lines of dP/dt',
  'step-rate-line-intersection': 'step-rate plot, where the two lines cross',
  manual: 'set by hand',
};

/** The plain words for a pick method id; an id not known here is shown with its dashes as spaces. */
export function methodWords(method: string): string {
  return METHOD_WORDS[method] ?? method.replace(/-/g, ' ');
}

/** The SHmax method line of the engine ("reopening-relation (cycle 2) with frictional-limit bounds (mu 0.6)") in plain words. */
export function stressMethodWords(method: string): string {
  return method.replace(/reopening-relation/g, 'reopening relation').replace(/frictional-limit/g, 'frictional limit').replace(/\bmu\b/g, 'μ');
}

/** Short names of the closure methods inside a sentence ("agree within 2 %: G-function 11.24 MPa, ..."). */
const CLOSURE_SHORT: [RegExp, string][] = [
  [/\bg-dpdg-tangent\b/g, 'G-function'],
  [/\bsqrt-time\b/g, 'square root of time'],
  [/\bbilinear-dpdt\b/g, 'bilinear dP/dt'],
];

/**
 * An engine sentence (criterion message, limit rationale) with the screens' typography:
 * R² and m³ written as such, closure method ids as short names. Numbers are left as they are.
 * @example messageWords('R2 0.9990, 35 MPa/m3') // 'R² 0.9990, 35 MPa/m³'
 */
export function messageWords(text: string): string {
  let out = text.replace(/\bR2\b/g, 'R²').replace(/\bm3\b/g, 'm³');
  for (const [pattern, words] of CLOSURE_SHORT) out = out.replace(pattern, words);
  return out;
}

/**
 * The caution every export and report of the regional model carries (DESIGN.md, Safety):
 * fracture gradients and stress models feed mud-weight windows, casing design and
 * injection limits, so their use stays with qualified people and the governing rules.
 */

/** Safety caution, one paragraph, for export header blocks, provenance sheets and JSON. */
export const SAFETY_CAUTION =
  'Results are for review by a qualified engineer. They are not a substitute for the operator\'s ' +
  'well-control policy and defer to local regulations and licensed practice.';

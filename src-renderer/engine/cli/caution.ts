/**
 * The safety caution carried by every command-line output (JSON field `caution`, and the
 * last lines of the text summary): the same text as every export (export/safety.ts).
 */
export { SAFETY_CAUTION } from '../export/safety';

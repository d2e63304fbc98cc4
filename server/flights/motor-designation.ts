/**
 * Reading a motor designation as printed on the motor: the total-impulse class, the average thrust in newtons,
 * then the delay to the ejection charge in seconds (`P` plugged: no charge; `S`/`M`/`L` an adjustable delay set
 * short, medium or long, with no number). Letters after the thrust or the delay name the propellant or the maker's
 * variant and are kept in the designation only. Pure: no I/O.
 *
 * Classes double per letter (NFPA 1125 motor classification, from memory): A is more than 1.25 up to 2.50 N s,
 * B up to 5, C up to 10 ... O up to 40,960; below A, 1/2A up to 1.25 and 1/4A up to 0.625.
 */
import type { MotorView } from '../../contracts/launches/launch-answers';

/** One motor as read from its designation: the shape the flight answers show, written once in contracts. */
export type MotorDesignation = MotorView;

const LETTERS = 'ABCDEFGHIJKLMNO';

interface ImpulseClassRange {
  impulseClass: string;
  minNs: number;
  maxNs: number;
}

/** The classes from smallest to largest with their total-impulse ranges. */
export const IMPULSE_CLASSES: readonly ImpulseClassRange[] = [
  { impulseClass: '1/4A', minNs: 0.3126, maxNs: 0.625 },
  { impulseClass: '1/2A', minNs: 0.626, maxNs: 1.25 },
  // A: 2.5 N s, doubling per letter; the lower end is the class below's maximum plus a hundredth, as tables print it.
  ...[...LETTERS].map((impulseClass, i) => {
    const maxNs = 2.5 * 2 ** i;
    return { impulseClass, minNs: Math.round((maxNs / 2 + 0.01) * 100) / 100, maxNs };
  }),
];

/** The range of one class, or undefined for a class Padside does not know. */
export function impulseClassRange(impulseClass: string): ImpulseClassRange | undefined {
  return IMPULSE_CLASSES.find((c) => c.impulseClass === impulseClass.toUpperCase());
}

/** Position of a class from the smallest (`1/4A` is 0); -1 for an unknown class. */
export function impulseClassRank(impulseClass: string): number {
  return IMPULSE_CLASSES.findIndex((c) => c.impulseClass === impulseClass.toUpperCase());
}

// class, average thrust, propellant letters, then optionally -delay (digits, or P/S/M/L) and trailing letters.
const DESIGNATION = /^(1\/[24]A|[A-O])(\d{1,4}(?:\.\d{1,2})?)([A-Z]{0,3})(?:-(\d{1,2}|[PSML]))?([A-Z]{0,3})$/;

/** Reads a designation such as `C6-5`, `F32-6T`, `H128W-M`, `1/2A3-4T` or `G80-P`; null when it cannot. */
export function parseMotorDesignation(text: string): MotorDesignation | null {
  const designation = text.trim().toUpperCase().replace(/\s+/g, '');
  const m = DESIGNATION.exec(designation);
  if (!m) return null;
  const [, impulseClass, thrust, , delay] = m;
  const averageThrustN = Number(thrust);
  if (!(averageThrustN > 0)) return null;
  const range = impulseClassRange(impulseClass)!;
  const plugged = delay === 'P';
  const delayS = delay !== undefined && /^\d+$/.test(delay) ? Number(delay) : null;
  return {
    designation,
    impulseClass,
    averageThrustN,
    delayS,
    plugged,
    totalImpulseMinNs: range.minNs,
    totalImpulseMaxNs: range.maxNs,
  };
}

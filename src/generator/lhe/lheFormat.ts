/**
 * The Les Houches Event file format as tamis writes and reads it: the init
 * block's content, number formatting and the field tokenizer.
 *
 * Standard: J. Alwall et al., "A standard format for Les Houches Event Files",
 * Comput. Phys. Commun. 176 (2007) 300, hep-ph/0609017, carrying the common
 * block contents of the original accord (E. Boos et al., hep-ph/0109068).
 *
 * Numbers: every real is written as a sign column (space or '-') and ten
 * significant digits in exponent form with an at-least-two-digit exponent,
 * e.g. " 1.234567890e+03" (16 characters). Ten digits survive a read into a
 * double and a write again unchanged, so write -> read -> write is
 * byte-identical and read values equal the printed decimals to the nearest
 * double. Spin (SPINUP) and proper lifetime (VTIMUP) use four digits.
 */

/** One process of the init block (XSECUP XERRUP XMAXUP LPRUP). */
export interface LheProcess {
  /** LPRUP: the id events of this process carry in IDPRUP. */
  processId: number;
  /** XSECUP, pb. */
  crossSectionPb: number;
  /** XERRUP, pb. */
  errorPb: number;
  /** XMAXUP: the largest event weight of the process. */
  maxWeight: number;
}

/** The init block: beams, parton densities, weighting strategy, processes. */
export interface LheInit {
  /** IDBMUP: PDG ids of the two beams (2212 for protons). */
  beamIds: [number, number];
  /** EBMUP: beam energies, GeV. */
  beamEnergies: [number, number];
  /** PDFGUP: parton-density author groups (tamis writes -1: not a set from a registry). */
  pdfGroups: [number, number];
  /** PDFSUP: parton-density set ids (tamis writes -1). */
  pdfSets: [number, number];
  /** IDWTUP: weighting strategy (tamis writes 3: unweighted events, all of equal weight). */
  weighting: number;
  processes: LheProcess[];
}

/** Status codes the standard defines (hep-ph/0109068): incoming, outgoing, space-like, resonance, documentation, beam. */
export const LHE_STATUS_CODES: readonly number[] = [-1, 1, -2, 2, 3, -9];

/** Largest particle count per event tamis accepts (the event record keeps mothers in 16-bit integers). */
export const LHE_MAX_PARTICLES = 10_000;

/**
 * Formats a real number for an LHE file: sign column and `digits` significant
 * digits in exponent form, exponent with at least two digits.
 *
 * @example
 * formatLheReal(1234.5) // ' 1.234500000e+03'
 * formatLheReal(-0.5, 4) // '-5.000e-01'
 */
export function formatLheReal(x: number, digits = 10): string {
  if (x === 0) return digits === 10 ? ' 0.000000000e+00' : digits === 4 ? ' 0.000e+00' : ` ${(0).toExponential(digits - 1)}0`;
  if (x === 9 && digits === 4) return ' 9.000e+00'; // SPINUP "unknown", on almost every line
  const s = x.toExponential(digits - 1);
  const e = s.indexOf('e');
  const exponent = s.length - e - 2 < 2 ? `${s[e + 1]}0${s.slice(e + 2)}` : s.slice(e + 1);
  return `${x < 0 ? '' : ' '}${s.slice(0, e)}e${exponent}`;
}

/** Right-aligns an integer in `width` characters (wider numbers push the column). */
export function formatLheInteger(n: number, width: number): string {
  return String(n).padStart(width, ' ');
}

/**
 * Splits `line` at blanks (space, tab) into at most `max` fields, writing
 * start and end offsets; returns the field count (max + 1 if there are more).
 */
export function splitFields(line: string, starts: Int32Array, ends: Int32Array, max: number): number {
  let count = 0;
  let i = 0;
  const n = line.length;
  while (i < n) {
    let c = line.charCodeAt(i);
    while (i < n && (c === 32 || c === 9 || c === 13)) c = line.charCodeAt(++i);
    if (i >= n) break;
    if (count === max) return max + 1;
    starts[count] = i;
    while (i < n && c !== 32 && c !== 9 && c !== 13) c = line.charCodeAt(++i);
    ends[count] = i;
    count++;
  }
  return count;
}

/**
 * Parses the real number in line[a, b): decimal digits, sign, point and an
 * exponent marked e, E, d or D (Fortran double precision). Returns NaN for
 * anything else and for values beyond the double range.
 */
export function parseLheReal(line: string, a: number, b: number): number {
  let fortran = false;
  for (let i = a; i < b; i++) {
    const c = line.charCodeAt(i);
    const ok = (c >= 48 && c <= 57) || c === 43 || c === 45 || c === 46 || c === 101 || c === 69;
    if (!ok) {
      if (c === 100 || c === 68) fortran = true;
      else return Number.NaN;
    }
  }
  let text = line.slice(a, b);
  if (fortran) text = text.replace(/[dD]/, 'e');
  const value = Number(text);
  return Number.isFinite(value) ? value : Number.NaN;
}

/** Parses a signed decimal integer in line[a, b) within +-2^31; NaN otherwise. */
export function parseLheInteger(line: string, a: number, b: number): number {
  if (b - a > 11) return Number.NaN;
  for (let i = a; i < b; i++) {
    const c = line.charCodeAt(i);
    if (!((c >= 48 && c <= 57) || ((c === 43 || c === 45) && i === a))) return Number.NaN;
  }
  const value = Number(line.slice(a, b));
  return Number.isInteger(value) && value >= -2147483648 && value <= 2147483647 ? value : Number.NaN;
}

/**
 * Colour tags of decay products (LHE ICOLUP columns).
 *
 * Each decay channel gets one colour pattern when the tables are compiled; at
 * run time the pattern copies the parent's tags or opens new ones. Colour
 * lines follow the Les Houches convention (hep-ph/0109068): a quark carries a
 * colour tag in ICOLUP1, an antiquark an anticolour tag in ICOLUP2, a gluon
 * both; new tags start at 501 (common practice).
 */
import { TamisError } from '../../errors.js';

/** No coloured daughter. */
export const COLOUR_NONE = 0;
/** Colour-singlet parent -> quark + antiquark (+ colourless): one new tag shared by the pair. */
export const COLOUR_PAIR = 1;
/** Colour-singlet parent -> two gluons (+ colourless): two new tags, crossed. */
export const COLOUR_GLUON_PAIR = 2;
/** Coloured parent -> one daughter in the same representation (+ colourless): the daughter keeps the parent's tags. */
export const COLOUR_INHERIT = 3;
/** Octet parent -> quark + antiquark (+ colourless): the quark takes the colour, the antiquark the anticolour. */
export const COLOUR_OCTET_SPLIT = 4;

/** First colour tag tamis opens in an event without colour (common practice). */
export const FIRST_COLOUR_TAG = 501;

/**
 * The colour pattern of parent (positive id) -> daughters, from the colour
 * representations (1, 3, 8) and the signs of the daughters' ids (a colour-3
 * particle with a negative id is an antitriplet). Throws a `bad_input`
 * TamisError naming the channel for colour structures tamis does not connect
 * (for example a colour-singlet parent to three quarks).
 */
export function colourPatternOf(parentColour: number, daughterIds: readonly number[], daughterColours: readonly number[], label: string): number {
  let triplets = 0;
  let antitriplets = 0;
  let octets = 0;
  for (let k = 0; k < daughterIds.length; k++) {
    const c = daughterColours[k]!;
    if (c === 3) {
      if (daughterIds[k]! > 0) triplets++;
      else antitriplets++;
    } else if (c === 8) octets++;
    else if (c !== 1) throw new TamisError('bad_input', `decay ${label}: unknown colour representation ${c}`);
  }
  const coloured = triplets + antitriplets + octets;
  if (parentColour === 1) {
    if (coloured === 0) return COLOUR_NONE;
    if (triplets === 1 && antitriplets === 1 && octets === 0) return COLOUR_PAIR;
    if (octets === 2 && triplets + antitriplets === 0) return COLOUR_GLUON_PAIR;
  } else if (parentColour === 3) {
    if (triplets === 1 && coloured === 1) return COLOUR_INHERIT;
  } else if (parentColour === 8) {
    if (octets === 1 && coloured === 1) return COLOUR_INHERIT;
    if (triplets === 1 && antitriplets === 1 && octets === 0) return COLOUR_OCTET_SPLIT;
  }
  throw new TamisError('bad_input', `decay ${label}: tamis cannot connect the colour lines of this channel`, {
    suggestion: 'colourless parents may decay to nothing coloured, a quark-antiquark pair or two gluons; coloured parents to one daughter of the same colour',
  });
}

/**
 * Writes the colour tags of the `count` daughters starting at record index
 * `first` (decay products of `parent`) for `pattern`, using `colourOf[k]` as
 * the representation of daughter k. Returns the next free tag.
 */
export function assignColours(
  pattern: number,
  ids: Int32Array,
  colour1: Int32Array,
  colour2: Int32Array,
  parent: number,
  first: number,
  count: number,
  colourOf: Uint8Array,
  colourOffset: number,
  nextTag: number,
): number {
  switch (pattern) {
    case COLOUR_PAIR: {
      for (let k = 0; k < count; k++) {
        if (colourOf[colourOffset + k] !== 3) continue;
        if (ids[first + k]! > 0) colour1[first + k] = nextTag;
        else colour2[first + k] = nextTag;
      }
      return nextTag + 1;
    }
    case COLOUR_GLUON_PAIR: {
      let seen = 0;
      for (let k = 0; k < count; k++) {
        if (colourOf[colourOffset + k] !== 8) continue;
        colour1[first + k] = seen === 0 ? nextTag : nextTag + 1;
        colour2[first + k] = seen === 0 ? nextTag + 1 : nextTag;
        seen++;
      }
      return nextTag + 2;
    }
    case COLOUR_INHERIT: {
      for (let k = 0; k < count; k++) {
        if (colourOf[colourOffset + k] === 1) continue;
        colour1[first + k] = colour1[parent]!;
        colour2[first + k] = colour2[parent]!;
      }
      return nextTag;
    }
    case COLOUR_OCTET_SPLIT: {
      for (let k = 0; k < count; k++) {
        if (colourOf[colourOffset + k] !== 3) continue;
        if (ids[first + k]! > 0) colour1[first + k] = colour1[parent]!;
        else colour2[first + k] = colour2[parent]!;
      }
      return nextTag;
    }
    default:
      return nextTag;
  }
}

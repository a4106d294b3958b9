/**
 * The bounds on the work one request may cause and on what Broodcast sends back or stores (docs/security.md
 * § Limits). Each is checked where the input arrives, before the costly work: JSON before it is parsed,
 * CSV lines and fields while the file streams, messages and stored report values when they are made.
 */
export const LIMITS = {
  /** Largest JSON body on most routes (the district boundary route allows JSON_BOUNDARY_MAX_BYTES). */
  JSON_BODY_MAX_BYTES: 1024 * 1024,
  JSON_BOUNDARY_MAX_BYTES: 10 * 1024 * 1024,
  /** Deepest nesting of arrays and objects in a JSON body (a GeoJSON Feature's MultiPolygon is 6 deep). */
  JSON_MAX_DEPTH: 32,
  /** Longest line (a CSV record, quoted line breaks included) of an uploaded file; past it the whole file is refused. */
  CSV_LINE_MAX_BYTES: 64 * 1024,
  /** Longest single CSV value; a row holding a longer one is rejected, the others load. */
  CSV_FIELD_MAX_CHARS: 1000,
  /** Longest error message, problem or stored message; the rest is cut, and the text says how much. */
  MESSAGE_MAX_CHARS: 1000,
  /** Longest value quoted in a row report or a field problem. */
  VALUE_MAX_CHARS: 200,
  /** Field problems listed in one error answer; the rest are counted (`fieldsNotListed`). */
  FIELDS_MAX: 50,
} as const;


/**
 * The one error type of the tamis library.
 *
 * Policy (see DEVELOPERS.md, "Errors"): library code throws a `TamisError`
 * carrying a stable `code`, and where the error comes from a user file, the
 * file, line, column and key path. Messages are lower-case and specific
 * ("background must be >= 0, got -1.2"). Only the CLI catches, prints
 * `formatError(e)` and exits non-zero.
 */

/** Stable machine-readable error codes, grouped by the part that throws them. */
export type TamisErrorCode =
  | 'bad_input' // a function argument or CLI option out of range
  | 'bad_file' // a file could not be read or parsed
  | 'schema' // a YAML/CSV file does not match its schema
  | 'expression' // a cut expression does not parse or names an unknown variable
  | 'physics' // a physically impossible request (decay below threshold, ...)
  | 'numeric' // a numerical procedure failed to converge
  | 'io' // writing an output failed
  | 'internal'; // a bug: an invariant of tamis itself was broken

/** Where in a user file an error was found. Lines and columns count from 1. */
export interface SourceLocation {
  file?: string;
  line?: number;
  column?: number;
  /** Path of the offending key, e.g. `regions[3].background`. */
  key?: string;
}

export interface TamisErrorOptions extends SourceLocation {
  /** A short hint on how to fix the input, printed after the message. */
  suggestion?: string;
  cause?: unknown;
}

export class TamisError extends Error {
  readonly code: TamisErrorCode;
  readonly file: string | undefined;
  readonly line: number | undefined;
  readonly column: number | undefined;
  readonly key: string | undefined;
  readonly suggestion: string | undefined;

  constructor(code: TamisErrorCode, message: string, options: TamisErrorOptions = {}) {
    super(message, options.cause === undefined ? undefined : { cause: options.cause });
    this.name = 'TamisError';
    this.code = code;
    this.file = options.file;
    this.line = options.line;
    this.column = options.column;
    this.key = options.key;
    this.suggestion = options.suggestion;
  }

  /** A copy of this error with location fields filled in where they were missing. */
  withLocation(location: SourceLocation): TamisError {
    return new TamisError(this.code, this.message, {
      file: this.file ?? location.file,
      line: this.line ?? location.line,
      column: this.column ?? location.column,
      key: this.key ?? location.key,
      suggestion: this.suggestion,
      cause: this.cause,
    });
  }
}

/**
 * One line for the terminal: `file:line:column: key: message (hint: suggestion)`.
 *
 * @example
 * formatError(new TamisError('schema', 'background must be >= 0, got -1.2',
 *   { file: 'a.yaml', line: 12, column: 17, key: 'regions[3].background' }))
 * // 'a.yaml:12:17: regions[3].background: background must be >= 0, got -1.2'
 */
export function formatError(error: unknown): string {
  if (error instanceof TamisError) {
    let where = '';
    if (error.file !== undefined) {
      where = error.file;
      if (error.line !== undefined) {
        where += `:${error.line}`;
        if (error.column !== undefined) where += `:${error.column}`;
      }
      where += ': ';
    }
    const key = error.key !== undefined && error.key !== '' ? `${error.key}: ` : '';
    const hint = error.suggestion !== undefined ? ` (hint: ${error.suggestion})` : '';
    return `${where}${key}${error.message}${hint}`;
  }
  if (error instanceof Error) return `internal error: ${error.message}`;
  return `internal error: ${String(error)}`;
}

/** Throws a `bad_input` error unless `condition` holds. */
export function requireInput(condition: boolean, message: string, options?: TamisErrorOptions): asserts condition {
  if (!condition) throw new TamisError('bad_input', message, options);
}

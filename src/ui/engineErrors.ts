/**
 * Errors raised by the JavaScript engine, the browser's storage or Dexie carry wording meant for programmers
 * ("Cannot read properties of null", "Maximum call stack size exceeded", "DataCloneError"). They never reach
 * the screen as they are: the crew gets a plain sentence, and the detail is kept for a "details" disclosure.
 */
const ENGINE_ERROR_NAMES = new Set([
  'TypeError', 'RangeError', 'SyntaxError', 'ReferenceError', 'EvalError', 'URIError', 'InternalError', 'AggregateError',
  'DataError', 'DataCloneError', 'UnknownError', 'ConstraintError', 'AbortError', 'NotFoundError', 'TransactionInactiveError',
  'ReadOnlyError', 'VersionError', 'TimeoutError', 'NotReadableError', 'SecurityError', 'EncodingError',
  'ModifyError', 'BulkError', 'UpgradeError', 'OpenFailedError', 'SchemaError', 'MissingAPIError', 'SubTransactionError',
  'PrematureCommitError', 'InvalidTableError', 'InvalidArgumentError', 'DatabaseClosedError', 'InvalidStateError',
]);

export const ENGINE_FALLBACK = 'Something went wrong inside Glintmark, so this was not done and nothing was changed. Try again; if it keeps failing, restart the app.';

/** True for an error whose message is engine wording, not a sentence written for the crew. */
export function isEngineError(e: unknown): boolean {
  return e instanceof Error ? ENGINE_ERROR_NAMES.has(e.name) : false;
}

/** The technical detail of an error, for a collapsed "details" disclosure at most. */
export const errorDetail = (e: unknown): string => (e instanceof Error ? `${e.name}: ${e.message}` : String(e));

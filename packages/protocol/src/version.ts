/**
 * The one integer both ends exchange in `hello`. Bump it whenever a message, event or view
 * changes shape in a way an older client cannot read; the server refuses any other number
 * with the error code "version-mismatch".
 */
export const PROTOCOL_VERSION = 1;

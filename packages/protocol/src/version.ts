/**
 * The one integer both ends exchange in `hello`. Bump it whenever a message, event or view
 * changes shape in a way an older client cannot read; the server refuses any other number
 * with the error code "version-mismatch".
 *   1: full views pushed after every commit
 *   2: views after the hello ack arrive as patches (`viewPatch`, RFC 6902)
 */
export const PROTOCOL_VERSION = 2;

/** The canonical text form of a UUID (RFC 9562 §4: 8-4-4-4-12 hex digits), the only one the API hands out or accepts. */
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export const isUuid = (value: unknown): value is string => typeof value === 'string' && UUID.test(value);

/**
 * How a found JSON value is named in an issue: its JSON type, and the value itself when short.
 * @param value any value read from JSON
 * @returns e.g. `string "5"`, `number 0`, `array`, `object`, `null`, `true`
 */
export function describeValue(value: unknown): string {
  if (value === null) return 'null';
  if (value === undefined) return 'nothing';
  if (Array.isArray(value)) return `an array of ${value.length}`;
  switch (typeof value) {
    case 'string': {
      const shown = value.length > 40 ? `${value.slice(0, 37)}...` : value;
      return `string ${JSON.stringify(shown)}`;
    }
    case 'number':
      return `number ${String(value)}`;
    case 'boolean':
      return String(value);
    default:
      return 'an object';
  }
}

/**
 * Throws a RangeError naming the path (e.g. "data.placement.scale") of the first value that
 * would not survive JSON unchanged: NaN and infinities (JSON.stringify turns them into null),
 * undefined, functions, symbols, bigints, and objects that are not plain (Date, Map, class
 * instances), so a message read back is exactly the message written.
 */
export function checkJsonValue(value: unknown, path: string): void {
  switch (typeof value) {
    case 'string':
    case 'boolean':
      return;
    case 'number':
      if (!Number.isFinite(value)) throw new RangeError(`${path} must be a finite number, got ${value}`);
      return;
    case 'object': {
      if (value === null) return;
      if (Array.isArray(value)) {
        value.forEach((item, i) => checkJsonValue(item, `${path}[${i}]`));
        return;
      }
      const proto = Object.getPrototypeOf(value);
      if (proto !== Object.prototype && proto !== null) throw new RangeError(`${path} must be a plain object, array or JSON value, got ${proto?.constructor?.name ?? 'an object'}`);
      for (const [key, item] of Object.entries(value)) checkJsonValue(item, `${path}.${key}`);
      return;
    }
    default:
      throw new RangeError(`${path} cannot be stored as JSON (${typeof value})`);
  }
}

/**
 * Guards for the public boundary of the core. Programmer and input errors throw RangeError/TypeError
 * whose message names the parameter, the value received and what is allowed, so the CLI and the
 * forms can show it to a field user unchanged.
 */

/** A finite number, or a RangeError naming `name`. */
export function requireFinite(name: string, value: number): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new RangeError(`${name} must be a finite number, got ${String(value)}`);
  }
  return value;
}

/** A number strictly greater than zero. */
export function requirePositive(name: string, value: number, unit = ''): number {
  requireFinite(name, value);
  if (!(value > 0)) throw new RangeError(`${name} must be greater than 0${unit ? ' ' + unit : ''}, got ${value}`);
  return value;
}

export interface RangeSpec {
  min: number;
  max: number;
  /** Include min (default true). */
  minInclusive?: boolean;
  /** Include max (default true). */
  maxInclusive?: boolean;
  unit?: string;
}

/** A number inside [min, max] (or open at either end), else a RangeError that states the interval. */
export function requireInRange(name: string, value: number, spec: RangeSpec): number {
  requireFinite(name, value);
  const loOk = spec.minInclusive === false ? value > spec.min : value >= spec.min;
  const hiOk = spec.maxInclusive === false ? value < spec.max : value <= spec.max;
  if (!loOk || !hiOk) {
    const lb = spec.minInclusive === false ? '(' : '[';
    const rb = spec.maxInclusive === false ? ')' : ']';
    const unit = !spec.unit ? '' : spec.unit === '°' ? '°' : ` ${spec.unit}`;
    throw new RangeError(`${name} must be in ${lb}${spec.min}, ${spec.max}${rb}${unit}, got ${value}`);
  }
  return value;
}

/** One of a fixed set of strings, else a RangeError listing the choices. */
export function requireOneOf<T extends string>(name: string, value: string, choices: readonly T[]): T {
  if (!(choices as readonly string[]).includes(value)) {
    throw new RangeError(`${name} must be one of ${choices.join(', ')}, got ${JSON.stringify(value)}`);
  }
  return value as T;
}

/** Incidence angle at the ground: open interval (0°, 90°). */
export const requireIncidenceDeg = (name: string, v: number) =>
  requireInRange(name, v, { min: 0, max: 90, minInclusive: false, maxInclusive: false, unit: '°' });

/** Latitude in [−90°, 90°]. */
export const requireLatDeg = (name: string, v: number) => requireInRange(name, v, { min: -90, max: 90, unit: '°' });

/** Longitude in [−180°, 360°] (360-degree east longitudes are accepted and wrapped by callers). */
export const requireLonDeg = (name: string, v: number) => requireInRange(name, v, { min: -180, max: 360, unit: '°' });

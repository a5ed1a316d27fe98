/**
 * Numeric ranges of the record schema, in one place, so the forms, file import, the team register and the
 * planner's flags refuse the same values with the same interval. Units are in the key names.
 */
export interface Bounds {
  min: number;
  max: number;
  unit: string;
  /** Exclude the bound itself. */
  minOpen?: boolean;
  maxOpen?: boolean;
}

export const RECORD_BOUNDS = {
  latDeg: { min: -90, max: 90, unit: 'degrees' },
  lonDeg: { min: -180, max: 180, maxOpen: true, unit: 'degrees' },
  /** Ellipsoidal heights between the deepest ocean trench and above the highest summit. */
  heightEllM: { min: -12000, max: 10000, unit: 'm' },
  edgeM: { min: 0, max: 20, minOpen: true, unit: 'm' },
  incidenceDeg: { min: 0, max: 90, minOpen: true, maxOpen: true, unit: 'degrees' },
  wavelengthM: { min: 0, max: 10, minOpen: true, unit: 'm' },
  azimuthDeg: { min: 0, max: 360, maxOpen: true, unit: 'degrees' },
  tiltDeg: { min: -90, max: 90, unit: 'degrees' },
  rollDeg: { min: -180, max: 180, minOpen: true, unit: 'degrees' },
} as const satisfies Record<string, Bounds>;

/** "(0, 20] m": the interval as the messages print it. */
export const boundsText = (b: Bounds): string => `${b.minOpen ? '(' : '['}${b.min}, ${b.max}${b.maxOpen ? ')' : ']'} ${b.unit}`;

export const inBounds = (x: number, b: Bounds): boolean =>
  Number.isFinite(x) && (b.minOpen ? x > b.min : x >= b.min) && (b.maxOpen ? x < b.max : x <= b.max);

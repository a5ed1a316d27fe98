import { TRIHEDRAL_SHAPES, type TrihedralShape } from '../reflector/trihedral.ts';
import { requireOneOf } from '../validate.ts';

/** The trihedral shapes, under the names the radar and UI code use (defined once in reflector/trihedral.ts). */
export type TrihedralShapeName = TrihedralShape;
export const SHAPE_NAMES = TRIHEDRAL_SHAPES;

export const requireShape = (shape: string): TrihedralShapeName => requireOneOf('shape', shape, SHAPE_NAMES);

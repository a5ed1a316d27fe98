/**
 * Valibot schemas of the editable fields of each table, and of whole rows (fields + RecordMeta) as they
 * appear in backups. Field objects are strict: a misspelt field name is an error, not silently dropped.
 */
import * as v from 'valibot';
import { RECORD_BOUNDS } from './ranges.ts';
import {
  AZIMUTH_METHODS,
  CHECK_STATES,
  GEOMETRY_SOURCES,
  POSITION_SOURCES,
  REFLECTOR_SHAPES,
  type EntityFieldsByTable,
  type EntityTable,
} from '../types.ts';
import {
  azimuthDeg,
  bool,
  finiteNumber,
  heightEllM,
  latDeg,
  lineText,
  listOf,
  lonDeg,
  nonNegativeNumber,
  noteText,
  oneOf,
  positiveNumber,
  rangeNumber,
  rollDeg,
  tiltDeg,
  timeMs,
  uuid,
} from './fields.ts';

const crew = listOf('crew', lineText('crew name', { min: 1, max: 80 }), 50);
const photoIds = listOf('photoIds', uuid('photo id'), 500);

export const siteFieldsSchema = v.strictObject({
  code: v.pipe(
    lineText('site code', { min: 1, max: 32 }),
    v.check((s) => s.trim() === s, 'site code must not start or end with spaces'),
  ),
  name: lineText('site name', { max: 200 }),
  latDeg: latDeg(),
  lonDeg: lonDeg(),
  heightEllM: heightEllM(),
  positionSource: oneOf('position source', POSITION_SOURCES),
  positionAccuracyM: v.nullable(nonNegativeNumber('position accuracy', 'm')),
  referenceFrame: lineText('reference frame', { min: 1, max: 40 }),
  frameEpoch: v.nullable(rangeNumber('frame epoch', { min: 1900, max: 2200, unit: '(decimal year)' })),
  notes: noteText('notes'),
  demo: bool('demo'),
});

const geodeticPoint = (label: string) =>
  v.strictObject({
    latDeg: latDeg(`${label} latitude`),
    lonDeg: lonDeg(`${label} longitude`),
    heightEllM: heightEllM(`${label} ellipsoidal height`),
  });

export const reflectorFieldsSchema = v.pipe(
  v.strictObject({
    siteId: uuid('site id'),
    label: lineText('reflector label', { min: 1, max: 80 }),
    shape: oneOf('shape', REFLECTOR_SHAPES),
    edgeM: rangeNumber('edge length', RECORD_BOUNDS.edgeM),
    construction: v.strictObject({
      panels: oneOf('panels', ['solid', 'mesh'] as const),
      meshOpeningMm: v.optional(positiveNumber('mesh opening', 'mm')),
      drainage: noteText('drainage', 2000),
      foundation: noteText('foundation', 2000),
    }),
    apex: v.nullable(geodeticPoint('apex')),
    apexHeightAboveMarkM: rangeNumber('apex height above mark', { min: -10, max: 50, unit: 'm' }),
    gnssArpOffsetM: v.nullable(
      v.strictObject({
        eastM: rangeNumber('antenna offset east', { min: -10, max: 10, unit: 'm' }),
        northM: rangeNumber('antenna offset north', { min: -10, max: 10, unit: 'm' }),
        upM: rangeNumber('antenna offset up', { min: -10, max: 10, unit: 'm' }),
      }),
    ),
    notes: noteText('notes'),
    demo: bool('demo'),
  }),
  v.forward(
    v.partialCheck(
      [['construction', 'panels'], ['construction', 'meshOpeningMm']],
      (x) => x.construction.panels === 'mesh' || x.construction.meshOpeningMm === undefined,
      'a mesh opening only applies to mesh panels',
    ),
    ['construction', 'meshOpeningMm'],
  ),
);

export const geometryFieldsSchema = v.strictObject({
  siteId: uuid('site id'),
  reflectorId: v.nullable(uuid('reflector id')),
  incidenceDeg: rangeNumber('incidence', RECORD_BOUNDS.incidenceDeg),
  headingDeg: azimuthDeg('heading'),
  look: oneOf('look side', ['right', 'left'] as const),
  direction: v.nullable(oneOf('pass direction', ['ascending', 'descending'] as const)),
  band: lineText('band', { min: 1, max: 16 }),
  wavelengthM: rangeNumber('wavelength', RECORD_BOUNDS.wavelengthM),
  source: oneOf('geometry source', GEOMETRY_SOURCES),
  satellite: v.nullable(lineText('satellite', { min: 1, max: 40 })),
  elementsEpochMs: v.nullable(timeMs('elements epoch')),
  demo: bool('demo'),
});

export const installationFieldsSchema = v.pipe(
  v.strictObject({
    reflectorId: uuid('reflector id'),
    siteId: uuid('site id'),
    geometryIds: listOf('geometryIds', uuid('geometry id'), 20),
    plannedAzimuthDeg: azimuthDeg('planned azimuth'),
    plannedTiltDeg: tiltDeg('planned tilt'),
    measuredAzimuthDeg: azimuthDeg('measured azimuth'),
    measuredTiltDeg: tiltDeg('measured tilt'),
    measuredRollDeg: rollDeg('measured roll'),
    azimuthMethod: oneOf('azimuth method', AZIMUTH_METHODS),
    declinationDeg: v.nullable(rangeNumber('declination', { min: -180, max: 180, unit: 'degrees' })),
    declinationModel: v.nullable(lineText('declination model', { min: 1, max: 40 })),
    fix: v.nullable(
      v.strictObject({
        latDeg: latDeg('fix latitude'),
        lonDeg: lonDeg('fix longitude'),
        accuracyM: nonNegativeNumber('fix accuracy', 'm'),
        atMs: timeMs('fix time'),
      }),
    ),
    predictedLossDb: v.nullable(nonNegativeNumber('predicted loss', 'dB')),
    crew,
    installedAtMs: timeMs('installation time'),
    notes: noteText('notes'),
    photoIds,
    demo: bool('demo'),
  }),
  v.forward(
    v.partialCheck(
      [['azimuthMethod'], ['declinationDeg']],
      (x) => x.azimuthMethod !== 'compass' || x.declinationDeg !== null,
      'a compass azimuth needs the declination that turned it into a true azimuth',
    ),
    ['declinationDeg'],
  ),
  v.forward(
    v.partialCheck(
      [['declinationDeg'], ['declinationModel']],
      (x) => x.declinationModel === null || x.declinationDeg !== null,
      'a declination model is given but no declination',
    ),
    ['declinationModel'],
  ),
);

const check = oneOf('checklist item', CHECK_STATES);

export const inspectionFieldsSchema = v.strictObject({
  reflectorId: uuid('reflector id'),
  siteId: uuid('site id'),
  inspectedAtMs: timeMs('inspection time'),
  checklist: v.strictObject({
    debris: check,
    standingWater: check,
    snowIce: check,
    vegetation: check,
    damage: check,
    movement: check,
  }),
  remeasured: v.nullable(
    v.strictObject({
      azimuthDeg: azimuthDeg('re-measured azimuth'),
      tiltDeg: tiltDeg('re-measured tilt'),
      rollDeg: rollDeg('re-measured roll'),
    }),
  ),
  crew,
  notes: noteText('notes'),
  photoIds,
  demo: bool('demo'),
});

/** Field schemas by table. The annotation makes the compiler check each schema's output against types.ts. */
export const FIELD_SCHEMAS: { [K in EntityTable]: v.GenericSchema<unknown, EntityFieldsByTable[K]> } = {
  sites: siteFieldsSchema,
  reflectors: reflectorFieldsSchema,
  geometries: geometryFieldsSchema,
  installations: installationFieldsSchema,
  inspections: inspectionFieldsSchema,
};

export const recordMetaSchema = v.strictObject({
  id: uuid('id'),
  rev: v.pipe(finiteNumber('rev'), v.integer('rev must be a whole number'), v.minValue(1, 'rev must be 1 or more')),
  createdAtMs: timeMs('creation time'),
  updatedAtMs: timeMs('update time'),
  deletedAtMs: v.nullable(timeMs('deletion time')),
});

/** The keys of RecordMeta, split off a row before its fields are validated. */
export const META_KEYS = ['id', 'rev', 'createdAtMs', 'updatedAtMs', 'deletedAtMs'] as const;

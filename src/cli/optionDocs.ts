/**
 * What `glintmark help COMMAND` and `glintmark COMMAND --help` print for each option: value, unit and default.
 * Kept apart from the commands so that adding a line here never touches a command's code. A command without an
 * entry shows its usage line only.
 */
import { DEFAULT_MAX_TILT_DEG } from '../core/alignment/deviceOrientation.ts';
import { DEFAULT_INCIDENCE_MAX_DEG, DEFAULT_INCIDENCE_MIN_DEG } from '../core/orbit/passes.ts';
import { DEFAULT_MAX_LOSS_DB } from '../core/reflector/compromise.ts';
export interface OptionDoc {
  /** The flag as typed, with its value placeholder: "--edge M". */
  flag: string;
  text: string;
  /** The default, when the option may be left out. */
  default?: string;
}

const wavelength: OptionDoc[] = [
  { flag: '--wavelength M', text: 'radar wavelength, metres, in (0, 10]' },
  { flag: '--frequency GHZ', text: 'or the radar centre frequency, GHz' },
  { flag: '--band L|S|C|X|Ku', text: 'or the radar band (its nominal centre wavelength)' },
];
const shape: OptionDoc = { flag: '--shape triangular|square', text: 'trihedral panel shape' };
const edge: OptionDoc = { flag: '--edge M', text: 'inner edge length, metres, in (0, 20]' };
const geometry: OptionDoc[] = [
  { flag: '--incidence DEG', text: 'incidence angle at the site, degrees, in (0, 90)' },
  { flag: '--heading DEG', text: 'azimuth of the satellite ground-track velocity, degrees clockwise from true north' },
  { flag: '--look right|left', text: 'radar look side', default: 'right' },
];
const json: OptionDoc = { flag: '--json', text: 'print exactly one JSON document instead of a table' };
const site: OptionDoc[] = [
  { flag: '--lat DEG', text: 'site latitude, degrees, positive north' },
  { flag: '--lon DEG', text: 'site longitude, degrees, positive east' },
];

export const OPTION_DOCS: Readonly<Record<string, readonly OptionDoc[]>> = {
  aim: [...geometry, { ...shape, default: 'triangular' }, { ...edge, default: '1 m' }, ...wavelength.map((w) => ({ ...w, default: w.flag.startsWith('--band') ? 'C' : undefined })), json],
  rcs: [shape, edge, ...wavelength, { flag: '--elevation DEG', text: 'elevation of the radar above the base plate, degrees' }, { flag: '--azimuth-offset DEG', text: 'azimuth of the radar from the bisector, degrees, clockwise positive' }, json],
  misalign: [
    ...geometry,
    { flag: '--reflector-azimuth DEG', text: 'azimuth the reflector faces, degrees true' },
    { flag: '--tilt DEG', text: 'base-plate tilt, degrees, open side up positive' },
    { flag: '--roll DEG', text: 'roll, degrees, right-hand side up positive', default: '0' },
    shape, edge, ...wavelength, json,
  ],
  size: [
    ...wavelength, shape,
    { flag: '--clutter-db DB', text: 'clutter backscatter σ⁰ of the surroundings, dB' },
    { flag: '--scr-db DB', text: 'target signal-to-clutter ratio, dB' },
    { flag: '--cell-area M2', text: 'ground resolution-cell area, m²' },
    { flag: '--range-resolution M', text: 'or slant-range resolution, metres (with --azimuth-resolution and --incidence)' },
    { flag: '--azimuth-resolution M', text: 'azimuth resolution, metres' },
    { flag: '--incidence DEG', text: 'incidence angle, degrees, in (0, 90)' },
    json,
  ],
  precision: [
    { flag: '--rcs-dbsm DB', text: 'reflector RCS, dBsm' },
    { flag: '--clutter-db DB', text: 'clutter backscatter σ⁰, dB' },
    { flag: '--cell-area M2', text: 'ground resolution-cell area, m²' },
    ...wavelength, json,
  ],
  compromise: [shape, edge, ...wavelength, { flag: '--geometry INC,HEADING,LOOK', text: 'a pass geometry (repeat for each); LOOK defaults to right' }, { flag: '--max-loss DB', text: 'loss above which separate reflectors are recommended, dB', default: String(DEFAULT_MAX_LOSS_DB) }, json],
  plan: [
    { flag: '--sites FILE', text: 'sites file (CSV with header code,latitude,longitude,height_m); - reads standard input' },
    { flag: '--geometry INC,HEADING,LOOK', text: 'a pass geometry (repeat for each)' },
    shape, edge, ...wavelength,
    { flag: '--one-reflector', text: 'one orientation per site serving every geometry (the best compromise)' },
    { flag: '--out FILE', text: 'write the rows to FILE instead of standard output (never one of the inputs)' },
    json,
  ],
  passes: [
    { flag: '--tle FILE', text: 'two-line element sets (one or more satellites); - reads standard input' },
    ...site,
    { flag: '--height M', text: 'site height above the WGS84 ellipsoid, metres', default: '0' },
    { flag: '--start ISO', text: 'window start, ISO 8601 date or date-time with zone (e.g. 2026-12-01T06:00Z)' },
    { flag: '--days N', text: 'window length, days, in (0, 366]' },
    { flag: '--incidence-min DEG', text: 'smallest incidence the radar uses, degrees', default: String(DEFAULT_INCIDENCE_MIN_DEG) },
    { flag: '--incidence-max DEG', text: 'largest incidence the radar uses, degrees', default: String(DEFAULT_INCIDENCE_MAX_DEG) },
    { flag: '--look right|left', text: 'radar look side', default: 'right' },
    { flag: '--tracks', text: 'group passes with the same geometry into tracks' },
    json,
  ],
  orient: [
    { flag: '--alpha DEG', text: 'device alpha from an absolute source, degrees in [0, 360] (0 = top toward magnetic north)' },
    { flag: '--beta DEG', text: 'device beta, degrees in [−180, 180]' },
    { flag: '--gamma DEG', text: 'device gamma, degrees in [−90, 90]' },
    { flag: '--declination DEG', text: 'magnetic declination, degrees, east positive; without it the azimuth stays magnetic' },
    { flag: '--max-tilt DEG', text: 'largest plate tilt measured before the phone counts as upright, degrees', default: String(DEFAULT_MAX_TILT_DEG) },
    json,
  ],
  declination: [...site, { flag: '--height M', text: 'height above the WGS84 ellipsoid, metres', default: '0' }, { flag: '--date ISO', text: 'date or date-time, ISO 8601 (WMM2025 is valid 2025-01-01 to 2030-01-01)' }, json],
  sun: [...site, { flag: '--time ISO', text: 'instant, ISO 8601 with a zone' }, { flag: '--height M', text: 'height above the ellipsoid, metres', default: '0' }, json],
  bearing: [{ flag: '--from LAT,LON', text: 'start point, degrees' }, { flag: '--to LAT,LON', text: 'end point, degrees' }, json],
  layout: [
    { flag: '--reference-azimuth DEG', text: 'azimuth of the reference line (shadow or sight line), degrees true' },
    { flag: '--target-azimuth DEG', text: 'azimuth to lay out, degrees true' },
    { flag: '--baseline M', text: 'tape length along the reference line, metres' },
    json,
  ],
};

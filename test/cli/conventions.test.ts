/** The planner behaves like a command-line tool: version, help, exit statuses, flag names, stdin, input caps. */
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { main, nameTheFlag } from '../../src/cli/main.ts';
import { expectUsageError, runCli } from './run.ts';

const pkg = JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as { version: string };
const dir = mkdtempSync(join(tmpdir(), 'glintmark-cli-'));

async function runWithStdin(argv: string[], stdin: string) {
  let stdout = '';
  let stderr = '';
  const code = await main(argv, {
    stdout: (s) => (stdout += s),
    stderr: (s) => (stderr += s),
    readStdin: async (max) => Buffer.from(stdin).subarray(0, max),
  });
  return { code, stdout, stderr };
}

describe('glintmark conventions', () => {
  it('--version, -V and version print the package version and exit 0', async () => {
    for (const a of ['--version', '-V', 'version']) {
      const r = await runCli([a]);
      expect(r.code).toBe(0);
      expect(r.stdout).toBe(`glintmark ${pkg.version}\n`);
    }
  });

  it('no command prints the short help and exits 0; an unknown command exits 2', async () => {
    const r = await runCli([]);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/^glintmark .* plan corner-reflector/);
    expect(r.stdout).toMatch(/Exit status: 0 done, 1 the work failed, 2 a usage error/);
    const u = await runCli(['aimm']);
    expect(u.code).toBe(2);
    expect(u.stderr).toMatch(/unknown command "aimm"/);
  });

  it('help COMMAND and COMMAND --help show the options with units and defaults', async () => {
    const a = await runCli(['help', 'aim']);
    const b = await runCli(['aim', '--help']);
    expect(a.code).toBe(0);
    expect(b.stdout).toBe(a.stdout);
    expect(a.stdout).toMatch(/--edge M\s+inner edge length, metres, in \(0, 20\] \(default 1 m\)/);
    expect(a.stdout).toMatch(/--band L\|S\|C\|X\|Ku\s+.*\(default C\)/);
    expect((await runCli(['help', 'passes'])).stdout).toMatch(/--incidence-min DEG\s+.*\(default 20\)/);
    expect((await runCli(['help', 'nothing'])).code).toBe(2);
  });

  it('absurd finite values are refused with the flag the user typed (no Infinity, no internal names)', async () => {
    await expectUsageError(['aim', '--incidence', '35', '--heading', '10', '--edge', '1e308'], /^glintmark aim: --edge must be in \(0, 20\] m, got 1e\+308$/m);
    await expectUsageError(['aim', '--incidence', '95', '--heading', '10'], /^glintmark aim: --incidence must be in \(0, 90\) degrees, got 95$/m);
    await expectUsageError(['size', '--wavelength', '0.05', '--shape', 'triangular', '--clutter-db', '-8', '--scr-db', '25', '--cell-area', '1e300'], /--cell-area must be in/);
    await expectUsageError(['layout', '--reference-azimuth', '10', '--target-azimuth', '20', '--baseline', '1e308'], /--baseline must be in/);
    await expectUsageError(['precision', '--rcs-dbsm', '1e300', '--clutter-db', '-8', '--cell-area', '10', '--wavelength', '0.05'], /--rcs-dbsm must be in/);
  });

  it('a core message naming its parameter is said with the flag (when that flag was given)', () => {
    expect(nameTheFlag('incidenceDeg must be in (0, 90)°, got 95', ['incidence'])).toBe('--incidence must be in (0, 90)°, got 95');
    expect(nameTheFlag('reflectorAzimuthDeg must be finite', ['reflector-azimuth'])).toBe('--reflector-azimuth must be finite');
    expect(nameTheFlag('points must be apart', ['from'])).toBe('points must be apart');
  });

  it('an input file that cannot be read is a failed run (exit 1); /dev/zero is refused, not read for ever', async () => {
    const z = await runCli(['passes', '--tle', '/dev/zero', '--lat', '1', '--lon', '2', '--start', '2026-12-01', '--days', '1']);
    expect(z.code).toBe(1);
    expect(z.stderr).toMatch(/^glintmark passes: cannot read --tle file "\/dev\/zero": it is not a regular file\n$/);
    const d = await runCli(['passes', '--tle', dir, '--lat', '1', '--lon', '2', '--start', '2026-12-01', '--days', '1']);
    expect(d.code).toBe(1);
    expect(d.stderr).toMatch(/it is a folder/);
  });

  it('- reads an input file from standard input', async () => {
    const csv = 'code,latitude,longitude,height_m\nMF-01,52.41,-1.23,61.2\n';
    const r = await runWithStdin(['plan', '--sites', '-', '--geometry', '40,190', '--shape', 'triangular', '--edge', '1.2', '--band', 'C', '--json'], csv);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    const rows = JSON.parse(r.stdout) as { siteCode: string }[];
    expect(rows.map((x) => x.siteCode)).toEqual(['MF-01']);
  });

  it('--out naming an input file is refused and the input is left as it was', async () => {
    const sites = join(dir, 'sites.csv');
    const csv = 'code,latitude,longitude,height_m\nMF-01,52.41,-1.23,61.2\n';
    writeFileSync(sites, csv);
    await expectUsageError(['plan', '--sites', sites, '--geometry', '40,190', '--shape', 'triangular', '--edge', '1.2', '--band', 'C', '--out', sites], /--out .* is the --sites input file/);
    expect(readFileSync(sites, 'utf8')).toBe(csv);
  });
});

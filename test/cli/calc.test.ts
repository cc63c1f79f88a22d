/** `comove calc`: formats, inputs and exit codes. */
import { describe, expect, it } from 'vitest';
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { runWithFiles } from '../helpers/cli.js';
import { relativeError } from '../helpers/cosmology.js';

const run = runWithFiles;

describe('comove calc', () => {
  it('prints JSON with the resolved parameters, units and one row per redshift', () => {
    const r = run(['calc', '--params', 'H0=70 Omega_m=0.3 flat', '--z', '0.5,1,2', '--json']);
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.params).toMatchObject({ H0: 70, h: 0.7, Omega_m: 0.3, Omega_k: 0, Omega_r: 0, flat: true });
    expect(out.units).toMatchObject({
      comovingDistance: 'Mpc', transverseComovingDistance: 'Mpc', angularDiameterDistance: 'Mpc', luminosityDistance: 'Mpc',
      distanceModulus: 'mag', lookbackTime: 'Gyr', age: 'Gyr', hubbleParameter: 'km/s/Mpc', properKpcPerArcsec: 'kpc/arcsec',
      comovingKpcPerArcsec: 'kpc/arcsec', comovingVolume: 'Gpc^3', cmbTemperature: 'K',
    });
    expect(out.rows.map((row: { z: number }) => row.z)).toEqual([0.5, 1, 2]);
    // astropy 5.2.1, FlatLambdaCDM(H0=70, Om0=0.3, Tcmb0=0): D_L(z=1) = 6607.657611774937 Mpc (test/reference/astropy-tables.json).
    expect(relativeError(out.rows[1].luminosityDistance, 6607.657611774937)).toBeLessThan(1e-9);
    expect(out.epochs.ageToday.unit).toBe('Gyr');
  });

  it('limits the columns with --quantities and prints CSV at full precision', () => {
    const r = run(['calc', '--params', 'planck-2018', '--z', '1 2', '--quantities', 'age,luminosityDistance', '--format', 'csv']);
    expect(r.code).toBe(0);
    const lines = r.stdout.trim().split('\n');
    expect(lines[0]).toBe('z,age [Gyr],luminosityDistance [Mpc]');
    expect(lines).toHaveLength(3);
    expect(lines[1].split(',')).toHaveLength(3);
    expect(Number(lines[1].split(',')[1])).toBeGreaterThan(5.8);
  });

  it('reads redshifts from a file with --z @file, skipping comments and blank lines', () => {
    const r = run(['calc', '--params', 'flat-70-0.3', '--z', '@zs.txt', '--format', 'csv', '--quantities', 'comovingDistance'], { 'zs.txt': '# survey fields\n0.1\n\n0.2 # second\n' });
    expect(r.code).toBe(0);
    expect(r.stdout.trim().split('\n')).toHaveLength(3);
  });

  it('prints a readable table with the parameter set, each quantity, and the epochs', () => {
    const r = run(['calc', '--params', 'planck-2018', '--z', '0.5,1']);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/^Parameter set {2}planck-2018: H0=67\.66/);
    expect(r.stdout).toMatch(/luminosity distance D_L +Mpc +2919\.64 +6791\.34/);
    expect(r.stdout).toMatch(/age today +13\.7871 +Gyr/);
    expect(r.stdout).toMatch(/r_drag used for checks +147\.184 +Mpc/);
  });

  it('exits 2 with a message naming the bad key', () => {
    for (const [params, key] of [
      ['H0=70 Omega_m=-0.3', 'Omega_m'],
      ['H0=70 Omega_q=0.3', 'Omega_q'],
      ['H0=-5 Omega_m=0.3', 'H0'],
      ['H0=70 Omega_m=0.3 Omega_Lambda=3', 'Omega_Lambda'],
    ]) {
      const r = run(['calc', '--params', params, '--z', '1']);
      expect(r.code, params).toBe(2);
      expect(r.stderr).toContain(key);
      expect(r.stdout).toBe('');
    }
  });

  it('exits 2 on bad redshifts, unknown options, formats, quantities and missing files', () => {
    expect(run(['calc', '--params', 'planck-2018', '--z', '1,abc']).stderr).toMatch(/'abc' is not a redshift/);
    expect(run(['calc', '--params', 'planck-2018', '--z', '-1']).code).toBe(2);
    expect(run(['calc', '--params', 'planck-2018', '--z', '@missing.txt']).stderr).toMatch(/cannot read missing.txt/);
    expect(run(['calc', '--params', 'planck-2018', '--z', '1', '--format', 'xml']).code).toBe(2);
    expect(run(['calc', '--params', 'planck-2018', '--z', '1', '--quantities', 'nope']).stderr).toMatch(/unknown quantity 'nope'/);
    expect(run(['calc', '--params', 'planck-2018', '--z', '1', '--frobnicate']).code).toBe(2);
    expect(run(['calc', '--z', '1']).stderr).toMatch(/needs --params/);
    expect(run(['nonsense']).code).toBe(2);
  });

  it('lists quantities and presets', () => {
    expect(run(['calc', '--list']).stdout).toMatch(/luminosityDistance +Mpc/);
    expect(run(['presets']).stdout).toMatch(/planck-2018 +Planck 2018/);
  });
});

describe('the built command (dist/cli.js)', () => {
  const cli = new URL('../../dist/cli.js', import.meta.url).pathname;
  it('exists after the build that runs before the tests', () => {
    expect(existsSync(cli)).toBe(true);
  });
  it('runs as a program and returns its exit codes', () => {
    const ok = execFileSync(process.execPath, [cli, 'calc', '--params', 'H0=70 Omega_m=0.3 flat', '--z', '1', '--quantities', 'luminosityDistance', '--format', 'csv'], { encoding: 'utf8' });
    expect(ok.trim().split('\n')[1]).toMatch(/^1,6607\.657/);
    const bad = spawnSync(process.execPath, [cli, 'calc', '--params', 'H0=70 Omega_m=0.3 Omega_Lambda=3', '--z', '1'], { encoding: 'utf8' });
    expect(bad.status).toBe(2);
    expect(bad.stderr).toMatch(/Omega_Lambda/);
  });
  it('prints 10⁵ redshifts as CSV', () => {
    const zs = Array.from({ length: 100_000 }, (_, i) => (i * 20) / 100_000).join('\n');
    const r = spawnSync(process.execPath, [cli, 'calc', '--params', 'planck-2018', '--z', '@-', '--format', 'csv', '--quantities', 'comovingDistance,luminosityDistance,age'], { input: zs, encoding: 'utf8', maxBuffer: 1 << 28 });
    expect(r.status).toBe(0);
    expect(r.stdout.trim().split('\n')).toHaveLength(100_001);
  });
});

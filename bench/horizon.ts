/**
 * Horizon ray march cost: a full 360° profile at 1° steps over synthetic grids (the UTM ridge-and-wall scene of the
 * tests, 601 × 801 cells of 20 m, and the geographic wall scene), measured in this run. Prints wall times and the
 * number of samples; asserts nothing.
 */
import { elevationGridFromGeoTiff } from '../src/cli/dem.ts';
import { horizonFromGrid } from '../src/core/horizon/rayMarch.ts';
import { geographicScene, utmScene } from '../test/core/horizon/scenes.ts';
import { timeMs } from './timing.ts';

export async function bench(): Promise<void> {
  for (const [name, tiff] of [['UTM 601×801, 20 m', utmScene().tiff], ['geographic 201×401, ~20 m', geographicScene().tiff]] as const) {
    const grid = await elevationGridFromGeoTiff(tiff, name);
    const { medianMs, result } = await timeMs(() => horizonFromGrid(grid, { latDeg: 45, lonDeg: 3, heightM: 2 }), 3);
    console.log(`horizon ${name}: 360 azimuths in ${medianMs.toFixed(0)} ms (median of 3), ${result.filter((p) => p.elevationDeg !== null).length} with terrain`);
  }
}

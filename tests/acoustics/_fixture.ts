/**
 * The acoustic path the tests and benchmarks share: NPS 4 schedule 40 carbon steel
 * (114.3 mm × 6.02 mm), water near 20 °C, an acrylic-like wedge at 38°, V mounting.
 *
 * @module
 */
import type { ClampOnInputs } from "../../lib/acoustics/path.ts";

/** One degree in radians. */
export const DEG: number = Math.PI / 180;

/** The shared path in SI (m, m/s, rad). */
export const STEEL_V: Readonly<ClampOnInputs> = Object.freeze({
  outsideDiameter: 0.1143,
  wallThickness: 0.00602,
  wallSoundSpeed: 5920,
  wallShearSpeed: 3230,
  fluidSoundSpeed: 1482,
  wedgeSoundSpeed: 2720,
  wedgeAngle: 38 * DEG,
  traverses: 2,
});

/** The same path as spacing.ts/transit.ts options, as a user types them (no --traverses). */
export const STEEL_V_OPTIONS: readonly string[] = Object.freeze([
  "--od",
  "114.3 mm",
  "--wall",
  "6.02 mm",
  "--wall-speed",
  "5920 m/s",
  "--wall-shear-speed",
  "3230 m/s",
  "--fluid-speed",
  "1482 m/s",
  "--wedge-speed",
  "2720 m/s",
  "--wedge-angle",
  "38 deg",
]);

/**
 * The liquid-water states the reference checks against Debian python3-iapws share.
 *
 * @module
 */

/**
 * 525 liquid states: 21 temperatures evenly from 273.16 K to 372.15 K, each at 25 pressures
 * log-spaced from 0.1 MPa to 10 MPa.
 *
 * @returns [T in K, p in Pa] pairs, temperature-major
 */
export function liquidWaterGrid(): [number, number][] {
  const states: [number, number][] = [];
  for (let i = 0; i <= 20; i++) {
    for (let j = 0; j < 25; j++) {
      states.push([273.16 + i * (372.15 - 273.16) / 20, 0.1e6 * Math.pow(100, j / 24)]);
    }
  }
  return states;
}

/**
 * UNESCO 1983 sound speed of seawater (Fofonoff & Millard 1983, eqs. 33–37; the Chen & Millero
 * 1977 equation). Coefficients: data/seawater/unesco1983.yaml.
 *
 * @module
 */
import { checkRange, type ValidityOptions } from "../errors.ts";
import { defaultRegistry } from "../registry/mod.ts";

interface Poly {
  i: Int8Array;
  j: Int8Array;
  c: Float64Array;
}
let polys: { Cw: Poly; A: Poly; B: Poly; D: Poly; t68: number } | undefined;

function poly(rows: number[][]): Poly {
  return {
    i: Int8Array.from(rows.map((r) => r[0])),
    j: Int8Array.from(rows.map((r) => r[1])),
    c: Float64Array.from(rows.map((r) => r[2])),
  };
}

function load() {
  if (polys) return polys;
  const reg = defaultRegistry();
  const k = reg.coefficients("seawater-unesco1983").coefficients;
  const f = reg.coefficients("water-t68-from-t90").coefficients.factor as number;
  polys = { Cw: poly(k.Cw), A: poly(k.A), B: poly(k.B), D: poly(k.D), t68: f };
  return polys;
}

function evalPoly(p: Poly, t: number, P: number): number {
  let s = 0;
  for (let n = 0; n < p.c.length; n++) s += p.c[n] * t ** p.i[n] * P ** p.j[n];
  return s;
}

/** Validity of the UNESCO 1983 equation: S 0–40, 0–40 °C, 0–1000 bar sea pressure. */
export const UNESCO1983_RANGE = {
  salinity: [0, 40] as [number, number],
  temperature: [273.15, 313.15] as [number, number],
  seaPressure: [0, 100e6] as [number, number],
};

const NAME = "UNESCO 1983 sound speed (Chen-Millero)";

/**
 * Sound speed of seawater by the UNESCO 1983 equation (Chen & Millero 1977 as given by
 * Fofonoff & Millard 1983): c = Cw(t, P) + A(t, P)·S + B(t, P)·S^1.5 + D(P)·S², with t the IPTS-68
 * Celsius temperature (t68 = 1.00024·t90) and P the sea pressure in bar.
 *
 * Validity: practical salinity 0–40, 0–40 °C, sea pressure 0–1000 bar (throws OutOfRangeError
 * outside unless extrapolate). Sources: fofonoff-millard-1983, chen-millero-1977, saunders-1990.
 *
 * @param S practical salinity (PSS-78, dimensionless)
 * @param T temperature, K (ITS-90)
 * @param p absolute pressure, Pa (sea pressure is p − 101 325 Pa)
 * @param options extrapolation opt-in and warnings sink
 * @returns sound speed, m/s
 *
 * @example
 * ```ts
 * import { soundSpeedUnesco1983 } from "./unesco.ts";
 * // UNESCO 1983 check value: S 40, t68 40 °C, 1000 bar -> 1731.995 m/s
 * const c = soundSpeedUnesco1983(40, 273.15 + 40 / 1.00024, 101325 + 1000e5);
 * if (Math.abs(c - 1731.995) > 5e-4) throw new Error(String(c));
 * ```
 */
export function soundSpeedUnesco1983(
  S: number,
  T: number,
  p: number,
  options?: ValidityOptions,
): number {
  const k = load();
  checkRange("practical salinity", S, UNESCO1983_RANGE.salinity, "", NAME, options);
  checkRange("temperature", T, UNESCO1983_RANGE.temperature, "K", NAME, options);
  const sea = p - 101325;
  checkRange("sea pressure", sea, UNESCO1983_RANGE.seaPressure, "Pa", NAME, options);
  if (S < 0) checkRange("practical salinity", S, [0, Infinity], "", NAME);
  const t = (T - 273.15) * k.t68;
  const P = sea / 1e5;
  return evalPoly(k.Cw, t, P) + evalPoly(k.A, t, P) * S +
    evalPoly(k.B, t, P) * S * Math.sqrt(S) + evalPoly(k.D, t, P) * S * S;
}

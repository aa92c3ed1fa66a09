/**
 * Water formulations per state: IAPWS-95 sound speed and density at (T, p) (each includes the
 * Newton density solve), IAPWS-95 at (T, rho), IF97 region 1, IAPWS 2008 viscosity.
 * Each bench evaluates 100 liquid states; divide the time per iteration by 100.
 */
import { iapws2008Viscosity, iapws95State, if97Region1, water } from "../lib/water/mod.ts";

const N = 100;
const T = Float64Array.from({ length: N }, (_, i) => 274 + i * 0.95);
const P = Float64Array.from({ length: N }, (_, i) => 2e5 + (i % 10) * 1e6);
water.soundSpeed(300); // load the registry and coefficient sets before timing
let sink = 0;

Deno.bench("IAPWS-95 water.soundSpeed(T, p), 100 states", { group: "water" }, () => {
  for (let i = 0; i < N; i++) sink += water.soundSpeed(T[i], P[i]);
});
Deno.bench("IAPWS-95 water.density(T, p), 100 states", { group: "water" }, () => {
  for (let i = 0; i < N; i++) sink += water.density(T[i], P[i]);
});
Deno.bench("IAPWS-95 iapws95State(T, rho), 100 states", { group: "water" }, () => {
  for (let i = 0; i < N; i++) sink += iapws95State(T[i], 990).w;
});
Deno.bench("IF97 region 1 water.soundSpeed(T, p, 'if97'), 100 states", { group: "water" }, () => {
  for (let i = 0; i < N; i++) sink += water.soundSpeed(T[i], P[i], "if97");
});
Deno.bench("IF97 if97Region1(T, p) all properties, 100 states", { group: "water" }, () => {
  for (let i = 0; i < N; i++) sink += if97Region1(T[i], P[i]).w;
});
Deno.bench("IAPWS 2008 iapws2008Viscosity(T, rho), 100 states", { group: "water" }, () => {
  for (let i = 0; i < N; i++) sink += iapws2008Viscosity(T[i], 990);
});
Deno.bench("water.viscosity(T, p) incl. IAPWS-95 density, 100 states", { group: "water" }, () => {
  for (let i = 0; i < N; i++) sink += water.viscosity(T[i], P[i]);
});
Deno.bench("Del Grosso-Mader polynomial, 100 states", { group: "water" }, () => {
  for (let i = 0; i < N; i++) {
    sink += water.soundSpeed(T[i] < 368 ? T[i] : 368, 101325, "del-grosso-mader");
  }
});
globalThis.addEventListener("unload", () => {
  if (!Number.isFinite(sink)) console.log(sink);
});

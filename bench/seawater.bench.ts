import { seawater } from "../lib/liquids/mod.ts";
import { liquidProperties } from "../lib/liquids/mod.ts";

let i = 0;
const T = (k: number) => 273.15 + (k % 40);
// Practical salinity 30–40, a different value at every call (1 000 distinct values in turn).
const S = (k: number) => 30 + (k * 7919 % 1000) / 100;
seawater.soundSpeed(35, 283.15); // load coefficients outside the timing

Deno.bench("seawater sound speed, TEOS-10 75-term incl. Θ from t (per point)", () => {
  seawater.soundSpeed(35, T(i++), 101325 + (i % 50) * 1e5);
});
Deno.bench("seawater sound speed, TEOS-10 75-term, salinity changing (per point)", () => {
  seawater.soundSpeed(S(i), T(i++), 101325 + (i % 50) * 1e5);
});
Deno.bench("seawater sound speed, TEOS-10 Gibbs function (per point)", () => {
  seawater.soundSpeed(35, T(i++), 101325 + (i % 50) * 1e5, "teos10-gibbs");
});
Deno.bench("seawater sound speed, TEOS-10 Gibbs function, salinity changing (per point)", () => {
  seawater.soundSpeed(S(i), T(i++), 101325 + (i % 50) * 1e5, "teos10-gibbs");
});
Deno.bench("seawater sound speed, UNESCO 1983 (per point)", () => {
  seawater.soundSpeed(35, T(i++), 101325 + (i % 50) * 1e5, "unesco1983");
});
Deno.bench("liquidProperties('toluene') (per point)", () => {
  liquidProperties("toluene", T(i++));
});

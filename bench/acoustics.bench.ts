/**
 * Benchmarks of the acoustic path: clampOnPath + transitTimes per evaluation.
 */
import { type ClampOnInputs, clampOnPath } from "../lib/acoustics/path.ts";
import { pathVelocity, transitTimes } from "../lib/acoustics/transit.ts";
import { STEEL_V as BASE } from "../tests/acoustics/_fixture.ts";

const LINED: ClampOnInputs = { ...BASE, lining: { thickness: 0.006, soundSpeed: 4000 } };
let sink = 0;

Deno.bench("clampOnPath + transitTimes (bare steel, V)", { group: "path", baseline: true }, () => {
  const p = clampOnPath(BASE);
  sink += transitTimes(p, 1.2).deltaT;
});

Deno.bench("clampOnPath + transitTimes (cement-lined, V)", { group: "path" }, () => {
  const p = clampOnPath(LINED);
  sink += transitTimes(p, 1.2).deltaT;
});

const P = clampOnPath(BASE);
const T = transitTimes(P, 1.2);
Deno.bench("transitTimes alone", { group: "times" }, () => {
  sink += transitTimes(P, 1.2).deltaT;
});
Deno.bench("pathVelocity (inverse, three forms)", { group: "times" }, () => {
  sink += pathVelocity(P, T.upstream, T.downstream).velocity;
});

addEventListener("unload", () => {
  if (sink === 42) console.log(sink);
});

import { frictionFactor, profileFactor } from "../lib/flow/mod.ts";
import { profileErrorEstimate, rankPositions } from "../lib/installation/mod.ts";

profileFactor(1e5); // load the registry before timing

Deno.bench("frictionFactor Colebrook (Newton, machine precision)", () => {
  frictionFactor(2.7e5, 3e-4);
});
Deno.bench("profileFactor diametral (closed form)", () => {
  profileFactor(2.7e5);
});
Deno.bench("profileFactor chord h/R 0.5 (48-node quadrature)", () => {
  profileFactor(2.7e5, { chord: 0.5 });
});
Deno.bench("profileFactor chord h/R 0.5, log-law", () => {
  profileFactor(2.7e5, { chord: 0.5, model: "log-law" });
});
Deno.bench("profileErrorEstimate elbow-90, V path", () => {
  profileErrorEstimate({ distanceDiameters: 7, fitting: "elbow-90", orientation: 0.4 });
});
Deno.bench("profileErrorEstimate out-of-plane elbows, W path, chord 0.3", () => {
  profileErrorEstimate({
    distanceDiameters: 7,
    fitting: "double-elbow-out-of-plane",
    traverses: 4,
    chordOffset: 0.3,
  });
});
Deno.bench("rankPositions 42 positions × 3 planes × 3 Re", () => {
  rankPositions({
    runLength: 6,
    diameter: 0.2,
    upstream: { fitting: "elbow-90" },
    downstream: { fitting: "gate-valve" },
    reynolds: [2e4, 1e5, 4e5],
  });
});

/**
 * Spot values from the standards, entered from memory of them (recalled), checked against the
 * catalogue. They are independent of the copy the catalogue was transcribed from, so a slip
 * in that copy at these rows would show here.
 */
import { closeAbs } from "../_assert.ts";
import { registry } from "../../lib/registry/mod.ts";

const SPOTS: [string, string, string, number, number][] = [
  // [standard, NPS, schedule, OD mm, wall mm] — ASME B36.10M, recalled.
  ["ASME B36.10M", "4", "40", 114.3, 6.02],
  ["ASME B36.10M", "8", "40", 219.1, 8.18],
  ["ASME B36.10M", "2", "80", 60.3, 5.54],
  ["ASME B36.10M", "6", "STD", 168.3, 7.11],
  ["ASME B36.10M", "12", "STD", 323.8, 9.53],
  ["ASME B36.10M", "24", "XS", 610, 12.7],
  // ASME B36.19M, recalled.
  ["ASME B36.19M", "2", "10S", 60.3, 2.77],
  ["ASME B36.19M", "4", "40S", 114.3, 6.02],
  // ASTM D1785 (inch values 4.500 in OD, 0.237 in minimum wall), recalled.
  ["ASTM D1785", "4", "40", 114.3, 6.0198],
];

Deno.test("spot values recalled from ASME B36.10M, B36.19M and ASTM D1785", () => {
  for (const [standard, nps, schedule, od, wall] of SPOTS) {
    const p = registry.pipe({ standard, nps, schedule });
    const what = `${standard} NPS ${nps} ${schedule}`;
    closeAbs(p.outsideDiameter * 1000, od, 1e-9, `${what} OD`);
    closeAbs(p.wallThickness * 1000, wall, 1e-9, `${what} wall`);
  }
});

Deno.test("IPS outside diameters are the inch values of the trade (recalled: 4.500 in, 8.625 in)", () => {
  // HDPE IPS and PVC use the exact inch OD; B36.10M rounds to 0.1 mm.
  closeAbs(
    registry.pipe({ standard: "hdpe", nps: 4, schedule: "DR 11" }).outsideDiameter,
    4.5 * 0.0254,
    1e-12,
    "4 in",
  );
  closeAbs(
    registry.pipe({ standard: "hdpe", nps: 8, schedule: "DR 17" }).outsideDiameter,
    8.625 * 0.0254,
    1e-12,
    "8 in",
  );
  closeAbs(
    registry.pipe({ standard: "PVC", nps: 8, schedule: "80" }).outsideDiameter,
    8.625 * 0.0254,
    1e-12,
    "PVC 8 in",
  );
});

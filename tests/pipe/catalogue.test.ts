/**
 * The catalogue queries: size and schedule forms, aliases, misses that name what exists
 * nearby, and invariants on every row.
 */
import { assert, closeAbs } from "../_assert.ts";
import { InputError, NotFoundError } from "../../lib/errors.ts";
import { registry } from "../../lib/registry/mod.ts";
import { normalizeSchedule, parseNominalSize } from "../../lib/registry/q_pipes.ts";

Deno.test("nominal sizes are read as the trade writes them", () => {
  for (
    const [text, v] of [
      ["1-1/2", 1.5],
      ["1 1/2", 1.5],
      ["1.5", 1.5],
      ["1½", 1.5],
      ["NPS 4", 4],
      ['4"', 4],
      ["4 in", 4],
      ["1/8", 0.125],
      ["3-1/2", 3.5],
    ] as const
  ) assert.equal(parseNominalSize(text), v, text);
  assert.equal(parseNominalSize(1.5), 1.5);
  for (const bad of ["", "four", "1//2", "-2", "0", "1-1/", "4 mm"]) {
    assert.throws(() => parseNominalSize(bad), InputError, bad);
  }
  assert.throws(() => parseNominalSize(Number.NaN), InputError);
});

Deno.test("schedule forms normalise to one key", () => {
  for (const s of ["40", "Sch 40", "sch40", "SCH-40", "Schedule 40", "40.0"]) {
    assert.equal(normalizeSchedule(s), "40", s);
  }
  assert.equal(normalizeSchedule("Standard"), "STD");
  assert.equal(normalizeSchedule("XH"), "XS");
  assert.equal(normalizeSchedule("double extra strong"), "XXS");
  assert.equal(normalizeSchedule("SDR 13.5"), normalizeSchedule("DR 13.5"));
  assert.equal(normalizeSchedule("Type L"), "L");
  assert.equal(normalizeSchedule("Class 350"), normalizeSchedule("PC 350"));
});

Deno.test("every way of naming one pipe gives the same record", () => {
  const ref = registry.pipe({ standard: "ASME B36.10M", nps: "1-1/2", schedule: "40" });
  for (
    const q of [
      { standard: "B36.10M", nps: "1 1/2", schedule: "sch40" },
      { standard: "asme b36.10", nps: 1.5, schedule: "Sch 40" },
      { standard: "ASME-B36.10M-2018", nps: "1.5", schedule: "40" },
      { standard: "asme-b36-10m", nps: "NPS 1-1/2", schedule: "SCH 40" },
    ]
  ) assert.equal(registry.pipe(q), ref, JSON.stringify(q));
  assert.equal(ref.nps, "1-1/2");
  assert.equal(ref.schedule, "40");
});

Deno.test("B36.19M takes a plain schedule number for the S schedule", () => {
  const p = registry.pipe({ standard: "B36.19M", nps: 12, schedule: "40" });
  assert.equal(p.schedule, "40S");
  // 40S and carbon-steel 40 differ at NPS 12 (9.53 vs 10.31 mm): the S was not dropped.
  closeAbs(p.wallThickness, 9.53e-3, 1e-12, "NPS 12 40S wall");
});

Deno.test("named weights and numbered schedules resolve at NPS 12", () => {
  const std = registry.pipe({ standard: "B36.10M", nps: 12, schedule: "STD" });
  const s40 = registry.pipe({ standard: "B36.10M", nps: 12, schedule: "40" });
  assert.notEqual(std.wallThickness, s40.wallThickness);
  const xs = registry.pipe({ standard: "B36.10M", nps: 12, schedule: "extra strong" });
  assert.equal(xs.schedule, "XS");
});

Deno.test("an unknown size names the sizes nearby", () => {
  assert.throws(
    () => registry.pipe({ standard: "ASME B36.10M", nps: 7, schedule: "40" }),
    (e: unknown) => {
      assert.ok(e instanceof NotFoundError);
      assert.deepEqual([...e.nearby], ["4", "5", "6", "8"]);
      assert.equal(e.exitCode, 2);
      return true;
    },
  );
});

Deno.test("an unknown schedule names the schedules at that size", () => {
  assert.throws(
    () => registry.pipe({ standard: "ASME B36.10M", nps: "3-1/2", schedule: "160" }),
    (e: unknown) => {
      assert.ok(e instanceof NotFoundError);
      assert.ok(e.nearby.includes("40") && e.nearby.includes("XS"));
      assert.ok(!e.nearby.includes("160"));
      return true;
    },
  );
});

Deno.test("an unknown standard names standards with similar names", () => {
  assert.throws(
    () => registry.pipe({ standard: "B36.01M", nps: 4, schedule: "40" }),
    (e: unknown) => {
      assert.ok(e instanceof NotFoundError);
      assert.ok(e.nearby.includes("B36.10M"), e.message);
      return true;
    },
  );
});

Deno.test("invariants on every catalogue row", () => {
  const all = registry.pipes();
  assert.ok(all.length > 700, `only ${all.length} rows`);
  const odByStdSize = new Map<string, number>();
  for (const p of all) {
    const label = `${p.standardId} ${p.nps} ${p.schedule}`;
    for (const v of [p.outsideDiameter, p.wallThickness, p.insideDiameter]) {
      assert.ok(Number.isFinite(v) && v > 0, `${label}: ${v}`);
    }
    closeAbs(p.insideDiameter, p.outsideDiameter - 2 * p.wallThickness, 1e-12, label);
    const k = `${p.standardId}|${p.nps}`;
    const od = odByStdSize.get(k);
    if (od === undefined) odByStdSize.set(k, p.outsideDiameter);
    else assert.equal(p.outsideDiameter, od, `${label}: one OD for every schedule`);
    if (p.lining) assert.ok(p.insideDiameter - 2 * p.lining.thickness > 0, label);
  }
  for (const std of registry.pipeStandards()) {
    for (const nps of std.sizes) {
      for (const series of std.series) {
        let prev = 0;
        let prevName = "";
        for (const sched of series) {
          const hit = registry.pipes({ standard: std.id, nps, schedule: sched });
          if (!hit.length) continue;
          const w = hit[0].wallThickness;
          assert.ok(
            w >= prev,
            `${std.standard} ${nps}: ${sched} wall ${w} < ${prevName} wall ${prev}`,
          );
          prev = w;
          prevName = sched;
        }
      }
    }
  }
});

Deno.test("HDPE walls are OD / DR (the standards' definition), to the stored 0.001 mm", () => {
  const rows = registry.pipes({ standard: "hdpe" });
  assert.ok(rows.length > 150);
  for (const p of rows) {
    const dr = Number(p.schedule.replace("DR ", ""));
    closeAbs(p.wallThickness, p.outsideDiameter / dr, 0.5e-6 + 1e-12, `${p.nps} ${p.schedule}`);
    assert.equal(p.basis, "computed");
    assert.equal(p.provenance.wallThickness.source, "astm-f714");
  }
});

Deno.test("listing filters by standard, size, schedule and material", () => {
  assert.deepEqual(registry.pipes({ standard: "PVC", nps: 4 }).map((p) => p.schedule), [
    "40",
    "80",
    "120",
  ]);
  const cu = registry.pipes({ material: "copper" });
  assert.ok(cu.length > 40 && cu.every((p) => p.standardId === "astm-b88"));
  const l = registry.pipes({ standard: "B88", schedule: "type L" });
  assert.ok(l.length > 10 && l.every((p) => p.schedule === "L"));
  assert.equal(registry.pipeStandard("ductile iron").id, "awwa-c151");
});

Deno.test("recalled data say so, with a spread", () => {
  const p = registry.pipe({ standard: "B36.10M", nps: 30, schedule: 40 as unknown as string });
  assert.equal(p.basis, "recalled");
  assert.ok((p.provenance.wallThickness.spread ?? 0) > 0);
  // Ductile iron: walls transcribed from public copies, the C104 lining still recalled.
  const di = registry.pipe({ standard: "AWWA C151", nps: 8, schedule: "PC 350" });
  assert.equal(di.basis, "transcribed");
  assert.ok(di.copy?.includes("copy-c151-pc-table"));
  assert.equal(di.lining?.material, "cement-mortar");
  assert.equal(di.lining?.basis, "recalled");
  assert.ok((di.lining?.spread ?? 0) > 0, "recalled lining keeps its spread");
});

Deno.test("tolerance sets resolve by id, standard and material", () => {
  assert.equal(registry.pipeTolerance("ASME B36.10M").id, "steel-seamless-a530");
  assert.equal(registry.pipeTolerance("carbon-steel").id, "steel-seamless-a530");
  assert.equal(registry.pipeTolerance("steel-welded-a53").source, "astm-a53");
  assert.equal(registry.pipeTolerance("hdpe").id, "hdpe-f714");
  const set = registry.pipeTolerance("B36.10M");
  assert.equal(set.rules[0].wall.minusFraction, 0.125);
  assert.throws(() => registry.pipeTolerance("unobtainium"), NotFoundError);
});

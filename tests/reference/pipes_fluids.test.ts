/**
 * Outside check: the pipe catalogue against the data tables of Debian's python3-fluids
 * (fluids.piping, package python3-fluids 1.0.22 when written; the version found is printed).
 *
 * Our ASME B36.10M, B36.19M, ASTM D1785, ASTM F441 rows and HDPE outside diameters were
 * transcribed from that same copy, so for them this check confirms the transcription (every
 * row present, no typing slip), not the standard itself. The HDPE walls are ours (OD / DR);
 * fluids' IPS tables print the standard's walls rounded to 0.001 in, so they are compared
 * within half of that (0.0127 mm), which does check our computed walls.
 */
import { assert } from "../_assert.ts";
import { debianVersion, hasPython, runPython } from "../_python.ts";
import { registry } from "../../lib/registry/mod.ts";

const HAVE = hasPython("fluids");

/** fluids.piping table key (or attribute prefix) → our standard id and schedule. */
const SCHEDULES: [string, string, string][] = [
  ...["5", "10", "20", "30", "40", "60", "80", "100", "120", "140", "160", "STD", "XS", "XXS"]
    .map((s): [string, string, string] => [s, "asme-b36-10m", s]),
  ...["5S", "10S", "40S", "80S"].map((s): [string, string, string] => [s, "asme-b36-19m", s]),
  ["40D1785", "astm-d1785", "40"],
  ["80D1785", "astm-d1785", "80"],
  ["120D1785", "astm-d1785", "120"],
  ["S40F441IPS", "astm-f441", "40"],
  ["S80F441IPS", "astm-f441", "80"],
];

const HDPE: [string, string][] = [
  ["325", "DR 32.5"],
  ["26", "DR 26"],
  ["21", "DR 21"],
  ["17", "DR 17"],
  ["135", "DR 13.5"],
  ["11", "DR 11"],
  ["9", "DR 9"],
  ["73", "DR 7.3"],
  ["7", "DR 7"],
];

const DUMP = `
import json, sys
import fluids.piping as P
req = json.load(sys.stdin)
out = {"tables": {}, "hdpe": {}}
for key in req["tables"]:
    N, Di, Do, t = P.schedule_lookup[key]
    out["tables"][key] = [list(map(float, x)) for x in (N, Di, Do, t)]
for dr in req["hdpe"]:
    N = getattr(P, "NPSDR%s_F2619" % dr)
    Do = getattr(P, "SDR%so_F2619IPS" % dr)
    t = getattr(P, "SDR%st_F2619IPS" % dr)
    out["hdpe"][dr] = [list(map(float, x)) for x in (N, Do, t)]
print(json.dumps(out))
`;

interface Dump {
  tables: Record<string, [number[], number[], number[], number[]]>;
  hdpe: Record<string, [number[], number[], number[]]>;
}

async function dump(): Promise<Dump> {
  return await runPython<Dump>(DUMP, {
    tables: SCHEDULES.map((s) => s[0]),
    hdpe: HDPE.map((h) => h[0]),
  });
}

Deno.test({
  name: "every B36.10M, B36.19M, D1785 and F441 row of python3-fluids agrees with ours",
  ignore: !HAVE,
  async fn() {
    const d = await dump();
    let worstOd = 0, worstWall = 0, worstId = 0, rows = 0;
    const seen = new Set<string>();
    for (const [key, std, sched] of SCHEDULES) {
      const [N, Di, Do, t] = d.tables[key];
      for (let i = 0; i < N.length; i++) {
        const p = registry.pipe({ standard: std, nps: N[i], schedule: sched });
        seen.add(`${std}|${p.nps}|${p.schedule}`);
        const dOd = Math.abs(p.outsideDiameter * 1000 - Do[i]);
        const dW = Math.abs(p.wallThickness * 1000 - t[i]);
        const dId = Math.abs(p.insideDiameter * 1000 - Di[i]);
        // Values were transcribed to 0.0001 mm; fluids' inside diameters are rounded to 0.01 mm.
        assert.ok(dOd <= 5e-5 + 1e-9, `${std} ${N[i]} ${sched}: OD differs by ${dOd} mm`);
        assert.ok(dW <= 5e-5 + 1e-9, `${std} ${N[i]} ${sched}: wall differs by ${dW} mm`);
        assert.ok(dId <= 0.011, `${std} ${N[i]} ${sched}: ID differs by ${dId} mm`);
        worstOd = Math.max(worstOd, dOd);
        worstWall = Math.max(worstWall, dW);
        worstId = Math.max(worstId, dId);
        rows++;
      }
    }
    // The other way round: every row of ours for these standards is in fluids, except the
    // one wall marked recalled (B36.10M NPS 30 Sch 40, absent from that copy).
    for (const std of ["asme-b36-10m", "asme-b36-19m", "astm-d1785", "astm-f441"]) {
      for (const p of registry.pipes({ standard: std })) {
        if (p.provenance.wallThickness.basis === "recalled") continue;
        assert.ok(
          seen.has(`${std}|${p.nps}|${p.schedule}`),
          `${std} ${p.nps} ${p.schedule} not in fluids`,
        );
      }
    }
    console.log(
      `python3-fluids ${
        debianVersion("python3-fluids")
      }: ${rows} rows; worst |ΔOD| ${worstOd} mm, ` +
        `|Δwall| ${worstWall} mm, |ΔID| ${worstId.toFixed(4)} mm`,
    );
  },
});

Deno.test({
  name: "HDPE IPS rows of python3-fluids (ASTM F2619 IPS tables) agree with ours",
  ignore: !HAVE,
  async fn() {
    const d = await dump();
    let worstOd = 0, worstWall = 0, rows = 0;
    for (const [dr, sched] of HDPE) {
      const [N, Do, t] = d.hdpe[dr];
      assert.equal(
        registry.pipes({ standard: "hdpe-ips", schedule: sched }).length,
        N.length,
        `${sched}: number of sizes`,
      );
      for (let i = 0; i < N.length; i++) {
        const p = registry.pipe({ standard: "hdpe-ips", nps: N[i], schedule: sched });
        const dOd = Math.abs(p.outsideDiameter * 1000 - Do[i]);
        const dW = Math.abs(p.wallThickness * 1000 - t[i]);
        assert.ok(dOd <= 5e-5, `NPS ${N[i]} ${sched}: OD differs by ${dOd} mm`);
        // Half of 0.001 in, the printing resolution of the standard's walls.
        assert.ok(dW <= 0.0127 + 5e-4, `NPS ${N[i]} ${sched}: wall differs by ${dW} mm`);
        worstOd = Math.max(worstOd, dOd);
        worstWall = Math.max(worstWall, dW);
        rows++;
      }
    }
    console.log(
      `python3-fluids ${debianVersion("python3-fluids")} HDPE: ${rows} rows; worst |ΔOD| ` +
        `${worstOd} mm, |Δwall| ${worstWall.toFixed(4)} mm`,
    );
  },
});

/**
 * Straight-run check and ranking of meter positions between two fittings. See
 * docs/installation.md.
 *
 * @module
 */
import {
  givenLine,
  optionalQuantity,
  parseCli,
  requireOption,
  requirePositiveQuantity,
  runMain,
  stringOptions,
} from "./_cli.ts";
import { inUnitOf, parseQuantity } from "../lib/units.ts";
import { InputError } from "../lib/errors.ts";
import { clockPosition } from "../lib/report/card.ts";
import { checkStraightRun, rankPositions, resolveFitting } from "../lib/installation/mod.ts";

const HELP = `
straight_run — straight-run check and best meter position between two fittings

Usage:
  deno task straight-run --diameter "200 mm" --upstream elbow-90 --run "6 m" --downstream gate-valve
  deno task straight-run --diameter "8 in" --upstream pump --run "20 D" --position "15 D"

Options:
  --diameter <length>      inside diameter (required)
  --upstream <fitting>     fitting upstream of the meter (required), e.g. elbow-90, pump, none
  --orientation <angle>    plane of the upstream fitting from the vertical (default "0 deg")
  --downstream <fitting>   fitting downstream of the meter (default none)
  --run <length>           straight run available between the two fittings (m, mm, in, or "25 D")
  --position <length>      proposed meter position from the upstream fitting (checked)
  --traverses <n>          bore crossings: 1 (Z), 2 (V, default), 4 (W)
  --reynolds <list>        Reynolds number(s), e.g. "2e4,1e5,3e5" for min,design,max (default 1e5)
  --json                   machine-readable output
  --debug                  stack traces on errors

Fittings: none (straight), elbow-90, double-elbow-in-plane, double-elbow-out-of-plane, reducer,
expander, tee-through, tee-branch, gate-valve, ball-valve, butterfly-valve, control-valve,
check-valve, pump, probe.

Results of the position ranking are estimates from a simple distorted-profile model, not a
calibration. Straight-run requirements are common practice; local codes, contracts and the
meter's documentation prevail. Site work on hot, pressurised or lagged lines, at height or in
confined spaces needs the site's permits and licensed practice.
`;

/** A length in m, or in diameters when written as "12 D". */
function parseLength(text: string, field: string, D: number): number {
  const m = /^\s*([-+]?[0-9]*\.?[0-9]+(?:[eE][-+]?[0-9]+)?)\s*D\s*$/.exec(text);
  const x = m ? Number(m[1]) * D : parseQuantity(text, "length", field);
  if (!Number.isFinite(x) || x < 0) {
    throw new InputError(field, JSON.stringify(text), 'a length ≥ 0 such as "2.4 m" or "12 D"');
  }
  return x;
}

runMain(() => {
  const { values: v } = parseCli(
    Deno.args,
    stringOptions(
      "diameter",
      "upstream",
      "orientation",
      "downstream",
      "run",
      "position",
      "traverses",
      "reynolds",
    ),
    HELP,
  );
  const D = requirePositiveQuantity(v, "diameter", "length", "200 mm");
  const up = resolveFitting(requireOption(v, "upstream", "a fitting id such as elbow-90"));
  const down = resolveFitting(typeof v.downstream === "string" ? v.downstream : "none");
  const orientation = optionalQuantity(v, "orientation", "angle", 0);
  const traverses = typeof v.traverses === "string" ? Number(v.traverses) : 2;
  if (![1, 2, 3, 4, 5, 6, 7, 8].includes(traverses)) {
    throw new InputError("--traverses", String(v.traverses), "1 (Z), 2 (V), 4 (W) or up to 8");
  }
  const reynolds = typeof v.reynolds === "string"
    ? v.reynolds.split(",").map((s) => {
      const x = Number(s.trim());
      if (!(x > 0) || !Number.isFinite(x)) {
        throw new InputError(
          "--reynolds",
          JSON.stringify(s),
          "positive numbers separated by commas",
        );
      }
      return x;
    })
    : [1e5];
  const run = typeof v.run === "string" ? parseLength(v.run, "--run", D) : undefined;
  const position = typeof v.position === "string"
    ? parseLength(v.position, "--position", D)
    : undefined;
  if (run === undefined && position === undefined) {
    throw new InputError("--run", "nothing", "the available run (--run) or a --position, or both");
  }
  if (run !== undefined && !(run > 0)) throw new InputError("--run", String(v.run), "a run > 0");
  if (run !== undefined && position !== undefined && position > run) {
    throw new InputError(
      "--position",
      `${v.position} (${r2(position)} m)`,
      `a position within the run of ${
        r2(run)
      } m: the downstream fitting cannot sit upstream of the meter`,
    );
  }
  const check = position !== undefined
    ? checkStraightRun({
      diameter: D,
      upstream: { fitting: up, distance: position },
      downstream: run !== undefined ? { fitting: down, distance: run - position } : undefined,
    })
    : undefined;
  const rank = run !== undefined
    ? rankPositions({
      runLength: run,
      diameter: D,
      upstream: { fitting: up.id, orientation },
      downstream: { fitting: down.id },
      traverses,
      reynolds,
    })
    : undefined;
  if (v.json) {
    console.log(JSON.stringify(
      {
        diameter: D,
        upstream: up.id,
        downstream: down.id,
        run,
        position,
        check,
        ranking: rank && { ...rank, ranking: rank.ranking.slice(0, 10) },
      },
      null,
      2,
    ));
    return 0;
  }
  const deg = (x: number) => `${Math.round(x * 180 / Math.PI)}°`;
  // lengths echoed in the unit the user wrote the run (or position, or diameter) in, beside SI
  const written = [v.run, v.position, v.diameter].find((x) =>
    typeof x === "string" && !/D\s*$/.test(x)
  ) as string | undefined;
  // "2.03 m (6.67 ft, 10 D)": the user's unit only when it is not a metric length
  const len = (x: number) => {
    const u = written === undefined ? undefined : inUnitOf(x, written, "length", 3);
    const echo = u && !/ (k|c|m|µ|u)?m$/.test(u) ? `${u}, ` : "";
    return `${r2(x)} m (${echo}${r1(x / D)} D)`;
  };
  if (check) {
    console.log(`Straight run at ${len(position!)}: ${check.verdict}`);
    for (const r of check.reasons) console.log(`  ${r}`);
  }
  if (rank && run !== undefined) {
    if (check) console.log("");
    console.log(sketch(up.id, down.id, run, D, rank, position));
    console.log("");
    console.log(
      `requirement: ${rank.requiredUpstream} D after ${up.id}, ${rank.requiredDownstream} D ` +
        `before ${down.id}; run ${r1(run / D)} D ${
          rank.meetsCommonPractice ? "holds it" : "is short"
        }`,
    );
    console.log(
      `common-practice position  ${len(rank.commonPracticePosition)}`,
    );
    console.log(
      `recommended position      ${len(rank.recommendedPosition)}, path plane ${
        deg(rank.recommendedOrientation)
      } from vertical`,
    );
    const pp = rank.recommendedPathPlane;
    // clock hours → the card's clock text (an hour is π/6 from the crown)
    const clock = (h: number) => clockPosition(h * Math.PI / 6);
    console.log(
      `transducers               ${
        pp.sameSide
          ? `both at ${clock(pp.clockHours[0])} o'clock`
          : `${clock(pp.clockHours[0])} and ${clock(pp.clockHours[1])} o'clock`
      }, looking downstream (12 o'clock at the crown)`,
    );
    console.log("");
    console.log("  position      plane   est. error   downstream   straight run");
    for (const r of rank.ranking.slice(0, 8)) {
      console.log(
        `  ${(r2(r.position) + " m").padEnd(12)}  ${deg(r.orientation).padStart(5)}   ${
          pct(r.estimatedError).padStart(9)
        }   ${pct(r.downstreamEffect).padStart(9)}    ${r.verdict}`,
      );
    }
    console.log("");
    for (const n of rank.notes) console.log(`note: ${n}`);
  }
  const given = givenLine(v, [["diameter", "length"], ["orientation", "angle"]]);
  if (given) console.log(given);
  return 0;
});

function sketch(
  upId: string,
  downId: string,
  run: number,
  D: number,
  rank: ReturnType<typeof rankPositions>,
  position?: number,
): string {
  const W = 60;
  const col = (x: number) => Math.max(0, Math.min(W - 1, Math.round(x / run * (W - 1))));
  const line = Array.from({ length: W }, (_, i) => {
    const x = i / (W - 1) * run;
    const ok = x / D >= rank.requiredUpstream && (run - x) / D >= rank.requiredDownstream;
    return ok ? "=" : "-";
  });
  const marks = Array(W).fill(" ");
  marks[col(rank.commonPracticePosition)] = "C";
  marks[col(rank.recommendedPosition)] = "R";
  if (position !== undefined) marks[col(position)] = "P";
  const left = `[${upId}]`;
  const pad = " ".repeat(left.length);
  const scale = `${pad}0${" ".repeat(W - 2 - `${r1(run / D)} D`.length)}${r1(run / D)} D`;
  return [
    `${pad}${marks.join("")}`,
    `${left}${line.join("")}[${downId}]  → flow`,
    scale,
    `${pad}= meets the straight-run rule, - does not; C common practice, R recommended` +
    (position !== undefined ? ", P proposed" : ""),
  ].join("\n");
}

function r1(x: number): string {
  return (Math.round(x * 10) / 10).toString();
}
function r2(x: number): string {
  return (Math.round(x * 100) / 100).toString();
}
function pct(x: number): string {
  return `${(x * 100).toFixed(2)} %`;
}

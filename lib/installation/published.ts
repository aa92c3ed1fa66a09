/**
 * The distorted-profile model held against published data on clamp-on readings behind
 * disturbances (data/installation/*.yaml): one check per published statement, Reynolds number,
 * mounting, distance and path angle, with the deviation from the published bound set against the
 * model's own stated spread. Used by `deno task verify` and the reference tests.
 *
 * @module
 */
import { InputError } from "../errors.ts";
import { defaultRegistry } from "../registry/mod.ts";
import type { Fitting } from "../registry/schemas/fittings.ts";
import { profileErrorEstimate } from "./model.ts";

/** Published tables checked, by id (data/installation/). */
export const INSTALLATION_DATA_TABLES: readonly string[] = Object.freeze([
  "synowiec-2021-bend",
  "sensors-2025-downstream-disturbance",
]);

/** Path angles checked round the pipe: every 30° (the angular step of synowiec-2021). */
export const CHECK_ANGLES: readonly number[] = Object.freeze(
  Array.from({ length: 12 }, (_, k) => k * Math.PI / 6),
);

/** Mountings checked where the publication does not state one: Z (1) and V (2) traverses. */
export const CHECK_TRAVERSES: readonly number[] = Object.freeze([1, 2]);

/** One check of the model against one published statement at one point. */
export interface InstallationCheck {
  /** Table id (data/installation/). */
  readonly table: string;
  /** Source id of the table. */
  readonly source: string;
  /** The published statement checked (the table's `statement`). */
  readonly statement: string;
  /** Distance from the fitting, D (for envelope checks, the distance of the worst point). */
  readonly distanceDiameters: number;
  /** Path-plane angle from the fitting's reference plane, rad (NaN for envelope checks). */
  readonly orientation: number;
  /** Bore crossings of the path. */
  readonly traverses: number;
  /** Reynolds number (NaN where the statement has none). */
  readonly reynolds: number;
  /** The model's value: correction factor K = 1/(1 + e), or the orientation range. */
  readonly model: number;
  /** Lower published bound. */
  readonly low: number;
  /** Upper published bound. */
  readonly high: number;
  /** Distance of the model value outside [low, high] (0 inside). */
  readonly deviation: number;
  /** The model's stated spread on the same quantity. */
  readonly spread: number;
  /** Whether the model value lies inside the bounds, or outside by no more than its spread. */
  readonly ok: boolean;
}

/**
 * Distances checked in [from, to] D (our grid: the publication's own distances are not at hand):
 * every 0.5 D below 10 D, then every 2 D.
 *
 * @param from first distance, D
 * @param to last distance, D
 * @returns the distances, D
 *
 * @example
 * ```ts
 * import { checkDistances } from "./published.ts";
 * if (checkDistances(8, 14).join() !== "8,8.5,9,9.5,10,12,14") throw new Error();
 * ```
 */
export function checkDistances(from: number, to: number): number[] {
  const out: number[] = [];
  for (let x = from; x <= to + 1e-9; x += x < 10 ? 0.5 : 2) out.push(Math.round(x * 10) / 10);
  return out;
}

function outside(v: number, lo: number, hi: number): number {
  return v < lo ? lo - v : v > hi ? v - hi : 0;
}

/** K = 1/(1 + e) and the spread carried over from the error's spread. */
function kOf(e: number, s: number): { k: number; sk: number } {
  const k = 1 / (1 + e);
  return { k, sk: s * k * k };
}

/**
 * Run the model against every published installation-effect table (or the ones named).
 *
 * - `synowiec-2021-bend` (single 90° bend, water): per row, each distance of the row's grid
 *   ({@link checkDistances}), each of the 12 path angles and Z and V paths: K = 1/(1 + e) within
 *   [kMin, kMax]; `worst-near-bend` rows check the worst K over the row's distances and angles
 *   instead (the abstract states an envelope, not a value per point).
 * - `sensors-2025-downstream-disturbance` (qualitative): at each distance of the row, the range
 *   of e over the 12 angles (V path, Re 10⁵) is at least `minOrientationRange`; the second row
 *   checks that the mean of two perpendicular planes has a smaller range than one plane.
 *
 * A check passes when the model value is inside the bounds or outside by no more than the
 * model's own stated spread on that quantity (its `spread`, carried to K).
 *
 * @param tables table ids, default {@link INSTALLATION_DATA_TABLES}
 * @param options `fitting`: the single-bend entry to check, default the registry's `elbow-90`
 *   (another entry lets a test show that a model off the published data fails)
 * @returns one entry per check
 *
 * @example
 * ```ts
 * import { checkInstallationData } from "./published.ts";
 * const checks = checkInstallationData(["synowiec-2021-bend"]);
 * if (checks.length < 100 || !checks.every((c) => c.ok)) throw new Error();
 * ```
 */
export function checkInstallationData(
  tables: readonly string[] = INSTALLATION_DATA_TABLES,
  options: { readonly fitting?: string | Fitting } = {},
): InstallationCheck[] {
  const reg = defaultRegistry();
  const bend = options.fitting ?? "elbow-90";
  const out: InstallationCheck[] = [];
  for (const id of tables) {
    if (!INSTALLATION_DATA_TABLES.includes(id)) {
      throw new InputError("tables", id, `one of ${INSTALLATION_DATA_TABLES.join(", ")}`);
    }
    const t = reg.table(id);
    for (const row of t.rows as Record<string, number | string>[]) {
      const statement = String(row.statement);
      const xs = checkDistances(Number(row.fromDiameters), Number(row.toDiameters));
      if (id === "synowiec-2021-bend") {
        const lo = Number(row.kMin), hi = Number(row.kMax), re = Number(row.reynolds);
        if (statement === "worst-near-bend") {
          for (const tr of CHECK_TRAVERSES) {
            let worst = { k: -Infinity, sk: 0, x: NaN };
            for (const x of xs.filter((x) => x < Number(row.toDiameters))) {
              for (const o of CHECK_ANGLES) {
                const r = profileErrorEstimate({
                  distanceDiameters: x,
                  fitting: bend,
                  orientation: o,
                  traverses: tr,
                  reynolds: re,
                });
                const { k, sk } = kOf(r.error, r.spread);
                if (k > worst.k) worst = { k, sk, x };
              }
            }
            const dev = outside(worst.k, lo, hi);
            out.push({
              table: id,
              source: t.source,
              statement,
              distanceDiameters: worst.x,
              orientation: NaN,
              traverses: tr,
              reynolds: re,
              model: worst.k,
              low: lo,
              high: hi,
              deviation: dev,
              spread: worst.sk,
              ok: dev <= worst.sk,
            });
          }
          continue;
        }
        for (const tr of CHECK_TRAVERSES) {
          for (const x of xs) {
            for (const o of CHECK_ANGLES) {
              const r = profileErrorEstimate({
                distanceDiameters: x,
                fitting: bend,
                orientation: o,
                traverses: tr,
                reynolds: re,
              });
              const { k, sk } = kOf(r.error, r.spread);
              const dev = outside(k, lo, hi);
              out.push({
                table: id,
                source: t.source,
                statement,
                distanceDiameters: x,
                orientation: o,
                traverses: tr,
                reynolds: re,
                model: k,
                low: lo,
                high: hi,
                deviation: dev,
                spread: sk,
                ok: dev <= sk,
              });
            }
          }
        }
      } else if (id === "sensors-2025-downstream-disturbance") {
        const min = Number(row.minOrientationRange);
        for (const x of xs) {
          const e = (o: number) =>
            profileErrorEstimate({ distanceDiameters: x, fitting: bend, orientation: o });
          const single = CHECK_ANGLES.map((o) => e(o).error);
          const range = (v: number[]) => Math.max(...v) - Math.min(...v);
          let model: number, lo: number;
          if (statement === "orientation-dependent") {
            model = range(single);
            lo = min;
          } else {
            const two = CHECK_ANGLES.map((o) => (e(o).error + e(o + Math.PI / 2).error) / 2);
            model = range(single) - range(two); // > 0 when two planes narrow the range
            lo = 1e-12;
          }
          const dev = outside(model, lo, Infinity);
          out.push({
            table: id,
            source: t.source,
            statement,
            distanceDiameters: x,
            orientation: NaN,
            traverses: 2,
            reynolds: 1e5,
            model,
            low: lo,
            high: Infinity,
            deviation: dev,
            spread: 0,
            ok: dev === 0,
          });
        }
      }
    }
  }
  return out;
}

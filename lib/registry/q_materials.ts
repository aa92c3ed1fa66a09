/**
 * Registry queries for materials: `registry.material(id)`, `registry.materials({ role })` and
 * `registry.materialSpeedAt(id, T, mode)`. Values leave in SI (m/s, kg/m³, K, Np/m, Hz, m),
 * each with a trace line naming its source and basis.
 *
 * @module
 */
import { checkRange, InputError, NotFoundError, type ValidityOptions } from "../errors.ts";
import { parseQuantity } from "../units.ts";
import type { Dimension } from "../units.ts";
import { trace, type TraceEntry } from "../trace.ts";
import type { LoadedRegistry } from "./load.ts";
import { nearest } from "./nearest.ts";
import type { MaterialEntry } from "./schemas/materials.ts";
import { speedPerKelvinFactor } from "./schemas/values.ts";

/** Roles a material plays in a clamp-on path. */
export type MaterialRole = "wall" | "lining" | "wedge";

/** How a datum got into the registry (see data/sources.yaml and DESIGN.md). */
export type MaterialBasis = "transcribed" | "computed" | "common-practice" | "recalled";
type Basis = MaterialBasis;

/** Acoustic attenuation of a material at one frequency, SI. */
export interface MaterialAttenuation {
  /** Amplitude attenuation coefficient, Np/m. */
  readonly value: number;
  /** Half-width of its spread, Np/m, when the data give one. */
  readonly spread?: number;
  /** Frequency it applies at, Hz. */
  readonly frequency: number;
  /** Wave mode it applies to. */
  readonly mode: "longitudinal" | "shear";
}

/** A material from the registry, in SI units. */
export interface MaterialProperties {
  /** Registry id, for example `carbon-steel`. */
  readonly id: string;
  /** Human name. */
  readonly name: string;
  /** Roles it plays in a clamp-on path. */
  readonly roles: readonly MaterialRole[];
  /** Longitudinal (compressional) sound speed at the reference temperature, m/s. */
  readonly longitudinal: number;
  /** Shear sound speed at the reference temperature, m/s (absent where no shear wave is usable). */
  readonly shear?: number;
  /** Density, kg/m³. */
  readonly density: number;
  /** Half-width of the spread of the longitudinal speed, m/s. */
  readonly longitudinalSpread?: number;
  /** Half-width of the spread of the shear speed, m/s. */
  readonly shearSpread?: number;
  /** Half-width of the spread of the density, kg/m³. */
  readonly densitySpread?: number;
  /** Temperature coefficient of the longitudinal speed, (m/s)/K. */
  readonly dLongitudinalDT?: number;
  /** Temperature coefficient of the shear speed, (m/s)/K. */
  readonly dShearDT?: number;
  /** Temperature range [min, max] in K over which the coefficients hold. */
  readonly temperatureRange?: readonly [number, number];
  /** Temperature at which speeds and density are given, K. */
  readonly referenceTemperature: number;
  /** Attenuation at the first listed frequency. */
  readonly attenuation?: MaterialAttenuation;
  /** Every attenuation datum listed. */
  readonly attenuations: readonly MaterialAttenuation[];
  /** Equivalent sand-grain roughness of a new bore, m. */
  readonly roughness?: number;
  /** Half-width of the spread of the new roughness, m. */
  readonly roughnessSpread?: number;
  /** Equivalent sand-grain roughness after years of service, m. */
  readonly roughnessAged?: number;
  /** Half-width of the spread of the aged roughness, m. */
  readonly roughnessAgedSpread?: number;
  /** The entry's default source id. */
  readonly source: string;
  /** The entry's default basis. */
  readonly basis: MaterialBasis;
  /** One line per datum: value, SI unit, source and basis. */
  readonly trace: readonly TraceEntry[];
}

/** Wave mode for {@link materialSpeedAt}. */
export type MaterialWaveMode = "longitudinal" | "shear";

/** Half-width, in kelvin, of the window around the reference temperature inside which a
 * material without a temperature coefficient is still used at its tabulated speed. */
export const NO_COEFFICIENT_WINDOW = 5;

interface Provenanced {
  readonly value: number;
  readonly unit: string;
  readonly spread?: number;
  readonly source?: string;
  readonly basis?: Basis;
}

function si(q: Provenanced, dimension: Dimension, field: string): number {
  return parseQuantity(`${q.value} ${q.unit}`, dimension, field);
}

/** SI factor of a quantity's unit (so a spread converts with the same factor). */
function siSpread(q: Provenanced, dimension: Dimension, field: string): number | undefined {
  if (q.spread === undefined) return undefined;
  if (dimension === "temperature") return q.spread; // K and degC steps are equal; degF unused
  return parseQuantity(`${q.spread} ${q.unit}`, dimension, field);
}

function toProperties(m: MaterialEntry): MaterialProperties {
  const lines: TraceEntry[] = [];
  const prov = (q: { source?: string; basis?: Basis }) => ({
    source: q.source ?? m.source,
    basis: q.basis ?? m.basis,
  });
  const add = (
    label: string,
    value: number,
    unit: string,
    q: { source?: string; basis?: Basis },
  ) => {
    const p = prov(q);
    lines.push(trace(`${m.id} ${label}`, value, unit, p.source, p.basis));
  };
  const f = (k: string) => `${m.id}.${k}`;
  const referenceTemperature = si(m.referenceTemperature, "temperature", f("referenceTemperature"));
  const longitudinal = si(m.longitudinal, "speed", f("longitudinal"));
  add("longitudinal sound speed", longitudinal, "m/s", m.longitudinal);
  const shear = m.shear ? si(m.shear, "speed", f("shear")) : undefined;
  if (m.shear && shear !== undefined) add("shear sound speed", shear, "m/s", m.shear);
  const density = si(m.density, "density", f("density"));
  add("density", density, "kg/m^3", m.density);
  add("reference temperature", referenceTemperature, "K", m.referenceTemperature);

  let dLongitudinalDT: number | undefined;
  let dShearDT: number | undefined;
  let temperatureRange: [number, number] | undefined;
  const tc = m.temperatureCoefficient;
  if (tc) {
    const tcProv = { source: tc.source ?? m.source, basis: tc.basis ?? m.basis };
    temperatureRange = [
      parseQuantity(tc.range.min, "temperature", f("temperatureCoefficient.range.min")),
      parseQuantity(tc.range.max, "temperature", f("temperatureCoefficient.range.max")),
    ];
    if (tc.longitudinal) {
      dLongitudinalDT = tc.longitudinal.value * speedPerKelvinFactor(tc.longitudinal.unit)!;
      add("d(longitudinal speed)/dT", dLongitudinalDT, "m/s/K", {
        source: tc.longitudinal.source ?? tcProv.source,
        basis: tc.longitudinal.basis ?? tcProv.basis,
      });
    }
    if (tc.shear) {
      dShearDT = tc.shear.value * speedPerKelvinFactor(tc.shear.unit)!;
      add("d(shear speed)/dT", dShearDT, "m/s/K", {
        source: tc.shear.source ?? tcProv.source,
        basis: tc.shear.basis ?? tcProv.basis,
      });
    }
  }

  const attenuations: MaterialAttenuation[] = (m.attenuation ?? []).map((a, i) => {
    const value = si(a, "attenuation", f(`attenuation[${i}]`));
    const frequency = si(a.frequency, "frequency", f(`attenuation[${i}].frequency`));
    add(`${a.mode} attenuation at ${frequency} Hz`, value, "Np/m", a);
    const spread = siSpread(a, "attenuation", f(`attenuation[${i}].spread`));
    return Object.freeze({
      value,
      frequency,
      mode: a.mode,
      ...(spread !== undefined ? { spread } : {}),
    });
  });

  const roughness = m.roughness ? si(m.roughness, "length", f("roughness")) : undefined;
  if (m.roughness && roughness !== undefined) add("roughness (new)", roughness, "m", m.roughness);
  const roughnessAged = m.roughnessAged
    ? si(m.roughnessAged, "length", f("roughnessAged"))
    : undefined;
  if (m.roughnessAged && roughnessAged !== undefined) {
    add("roughness (aged)", roughnessAged, "m", m.roughnessAged);
  }

  const out: Record<string, unknown> = {
    id: m.id,
    name: m.name,
    roles: Object.freeze([...m.roles]),
    longitudinal,
    density,
    referenceTemperature,
    attenuations: Object.freeze(attenuations),
    source: m.source,
    basis: m.basis,
    trace: Object.freeze(lines),
  };
  const opt = (k: string, v: unknown) => {
    if (v !== undefined) out[k] = v;
  };
  opt("shear", shear);
  opt("longitudinalSpread", siSpread(m.longitudinal, "speed", f("longitudinal.spread")));
  opt("shearSpread", m.shear ? siSpread(m.shear, "speed", f("shear.spread")) : undefined);
  opt("densitySpread", siSpread(m.density, "density", f("density.spread")));
  opt("dLongitudinalDT", dLongitudinalDT);
  opt("dShearDT", dShearDT);
  opt("temperatureRange", temperatureRange ? Object.freeze(temperatureRange) : undefined);
  opt("attenuation", attenuations[0]);
  opt("roughness", roughness);
  opt(
    "roughnessSpread",
    m.roughness ? siSpread(m.roughness, "length", f("roughness.spread")) : undefined,
  );
  opt("roughnessAged", roughnessAged);
  opt(
    "roughnessAgedSpread",
    m.roughnessAged ? siSpread(m.roughnessAged, "length", f("roughnessAged.spread")) : undefined,
  );
  return Object.freeze(out) as unknown as MaterialProperties;
}

const ROLES: readonly string[] = ["wall", "lining", "wedge"];

/** The material queries merged into `registry`. */
export interface MaterialQueries {
  /** A material by id, SI, with its trace; misses name the nearest ids. */
  material(id: string): MaterialProperties;
  /** Every material, or those playing one role. */
  materials(options?: { role?: MaterialRole }): readonly MaterialProperties[];
  /** Sound speed (m/s) at temperature (K) by the linear temperature coefficient. */
  materialSpeedAt(
    id: string,
    temperature: number,
    mode?: MaterialWaveMode,
    options?: ValidityOptions,
  ): number;
}

/**
 * Queries over the materials data, bound to one loaded registry. Every material is converted
 * to SI once, when the queries are built; the queries then allocate nothing per call.
 *
 * @param loaded the loaded registry
 * @returns `material(id)`, `materials({ role })`, `materialSpeedAt(id, T, mode, options)`
 *
 * @example
 * ```ts
 * import { loadRegistry } from "./load.ts";
 * import { materialQueries } from "./q_materials.ts";
 * const q = materialQueries(loadRegistry(new URL("../../data/", import.meta.url)));
 * const steel = q.material("carbon-steel");
 * if (steel.shear === undefined || steel.shear > steel.longitudinal) throw new Error("shear");
 * if (!q.materials({ role: "wedge" }).some((m) => m.id === "acrylic")) throw new Error("wedge");
 * const hot = q.materialSpeedAt("acrylic", 313.15, "longitudinal");
 * if (!(hot < q.material("acrylic").longitudinal)) throw new Error("acrylic slows when warm");
 * ```
 */
export function materialQueries(loaded: LoadedRegistry): MaterialQueries {
  // Entries are turned into SI properties on first use (a plan asks for three or four of them).
  const entries = new Map<string, MaterialEntry>();
  for (const d of loaded.docs) {
    if (d.kind !== "materials") continue;
    for (const m of d.data.materials as MaterialEntry[]) entries.set(m.id, m);
  }
  const byId = new Map<string, MaterialProperties>();
  const propertiesOf = (id: string): MaterialProperties | undefined => {
    let p = byId.get(id);
    if (p === undefined) {
      const m = entries.get(id);
      if (m === undefined) return undefined;
      p = toProperties(m);
      byId.set(id, p);
    }
    return p;
  };
  let all: readonly MaterialProperties[] | undefined;
  const everyMaterial = () =>
    all ??= Object.freeze([...entries.keys()].map((id) => propertiesOf(id)!));
  const byRole = new Map<string, readonly MaterialProperties[]>();

  /**
   * A material by id, in SI units with its trace.
   *
   * Sources: each datum's own (see `trace`), mostly selfridge-1985, asm-handbook-17,
   * kaye-laby-sound (sound speeds, densities; recalled) and idelchik-2007,
   * farshad-rieke-2006, white-fluid-mechanics-2011 (roughness).
   *
   * @param id material id, for example `carbon-steel`, `acrylic`
   * @returns the material's properties (m/s, kg/m³, K, Np/m, Hz, m)
   * @throws {NotFoundError} naming the nearest ids when there is no such material
   */
  function material(id: string): MaterialProperties {
    const m = typeof id === "string" ? propertiesOf(id) : undefined;
    if (!m) throw new NotFoundError("material", id, nearest(String(id), [...entries.keys()], 3));
    return m;
  }

  /**
   * Every material, or those playing one role.
   *
   * @param options `role`: `wall`, `lining` or `wedge`
   * @returns the materials, in data-file order
   * @throws {InputError} on an unknown role
   */
  function materials(options?: { role?: MaterialRole }): readonly MaterialProperties[] {
    const role = options?.role;
    if (role === undefined) return everyMaterial();
    if (!ROLES.includes(role)) {
      throw new InputError("role", JSON.stringify(role), "one of: wall, lining, wedge");
    }
    let list = byRole.get(role);
    if (!list) {
      list = Object.freeze(everyMaterial().filter((m) => m.roles.includes(role)));
      byRole.set(role, list);
    }
    return list;
  }

  /**
   * Sound speed of a material at a temperature, by the linear temperature coefficient:
   * c(T) = c(T₀) + (dc/dT)·(T − T₀), with T₀ the entry's reference temperature.
   *
   * Validity: the coefficient's own temperature range (data/materials.yaml). A material
   * without a coefficient gives its tabulated speed within ±{@link NO_COEFFICIENT_WINDOW} K of
   * T₀ only. Outside, an OutOfRangeError is thrown unless `options.extrapolate` is set (then
   * a warning is pushed to `options.warnings`).
   *
   * @param id material id
   * @param temperature temperature, K
   * @param mode `longitudinal` (default) or `shear`
   * @param options extrapolation opt-in and warning sink
   * @returns sound speed, m/s
   * @throws {NotFoundError} unknown id; {@link InputError} no shear speed for this material;
   *   {@link OutOfRangeError} outside the validity range
   */
  function materialSpeedAt(
    id: string,
    temperature: number,
    mode: MaterialWaveMode = "longitudinal",
    options?: ValidityOptions,
  ): number {
    const m = material(id);
    if (mode !== "longitudinal" && mode !== "shear") {
      throw new InputError("mode", JSON.stringify(mode), "longitudinal or shear");
    }
    const c0 = mode === "shear" ? m.shear : m.longitudinal;
    if (c0 === undefined) {
      throw new InputError(
        "mode",
        `shear for ${id}`,
        "longitudinal (the registry holds no shear speed for this material)",
      );
    }
    const k = mode === "shear" ? m.dShearDT : m.dLongitudinalDT;
    const t0 = m.referenceTemperature;
    if (k === undefined || !m.temperatureRange) {
      checkRange(
        "temperature",
        temperature,
        [t0 - NO_COEFFICIENT_WINDOW, t0 + NO_COEFFICIENT_WINDOW],
        "K",
        `${m.name} ${mode} sound speed at its reference temperature (no temperature coefficient)`,
        options,
      );
      return c0;
    }
    checkRange(
      "temperature",
      temperature,
      m.temperatureRange,
      "K",
      `${m.name} ${mode} sound speed, linear temperature coefficient`,
      options,
    );
    const c = c0 + k * (temperature - t0);
    if (!(c > 0)) {
      throw new InputError(
        "temperature",
        `${temperature} K`,
        `a temperature at which the linear model of ${id} gives a positive speed`,
      );
    }
    return c;
  }

  return { material, materials, materialSpeedAt };
}

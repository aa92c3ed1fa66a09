/**
 * The sourced reference-data registry: load once, validate, freeze, hash, query.
 *
 * @example
 * ```ts
 * import { registry } from "./mod.ts";
 * if (registry.hash.length !== 64) throw new Error("hash");
 * if (!registry.source("iapws-r6-95").citation.includes("IAPWS")) throw new Error("source");
 * ```
 *
 * @module
 */
import {
  fullValidationLoaded,
  type LoadedRegistry,
  loadRegistry,
  primeSnapshot,
} from "./load_snapshot.ts";
import { type CoreQueries, coreQueries } from "./core.ts";
import { type PipeQueries, pipeQueries } from "./q_pipes.ts";
import { type MaterialQueries, materialQueries } from "./q_materials.ts";
import { type LiquidQueries, liquidQueries } from "./q_liquids.ts";
import { type FittingQueries, fittingQueries } from "./q_fittings.ts";

export {
  buildSnapshot,
  canonicalJson,
  loadRegistry,
  loadRegistryAsync,
  MAX_DATA_FILE_BYTES,
  SNAPSHOT_FILE,
} from "./load_snapshot.ts";
export type { DataDoc, LoadedRegistry, LoadOptions } from "./load_snapshot.ts";
export { nearest } from "./nearest.ts";
export { checkVerificationTable, recalledRows } from "./verify.ts";
export type {
  RecalledRow,
  RowEvaluator,
  ToTableUnit,
  VerificationCheck,
  VerificationTableData,
} from "./verify.ts";
export type { SourceEntry } from "./schemas/sources.ts";
export type { CoreQueries } from "./core.ts";
export type { PipeQueries } from "./q_pipes.ts";
export type { FittingQueries } from "./q_fittings.ts";
export type { LiquidQueries } from "./q_liquids.ts";
export type {
  LiquidDensityModel,
  LiquidEntry,
  LiquidPoint,
  LiquidProvenance,
  LiquidRange,
  LiquidSoundSpeedModel,
  LiquidViscosityModel,
} from "./schemas/liquids.ts";
export type {
  MaterialAttenuation,
  MaterialBasis,
  MaterialProperties,
  MaterialQueries,
  MaterialRole,
  MaterialWaveMode,
} from "./q_materials.ts";

/**
 * Build the query object over loaded data.
 *
 * @param loaded data from {@link loadRegistry}
 * @returns the registry: hash, sources, pipes, materials, liquids, fittings, tables
 *
 * @example
 * ```ts
 * import { createRegistry, loadRegistry } from "./mod.ts";
 * const reg = createRegistry(loadRegistry(new URL("../../data/", import.meta.url)));
 * if (reg.sources().length < 1) throw new Error("sources");
 * ```
 */
export function createRegistry(loaded: LoadedRegistry): Registry {
  return Object.freeze({
    ...coreQueries(loaded),
    ...pipeQueries(loaded),
    ...materialQueries(loaded),
    ...liquidQueries(loaded),
    ...fittingQueries(loaded),
  });
}

/** The registry's query object: core, pipe, material, liquid and fitting queries. */
export type Registry =
  & CoreQueries
  & PipeQueries
  & MaterialQueries
  & LiquidQueries
  & FittingQueries;

/** The bundled data folder. */
export const DATA_DIR: URL = new URL("../../data/", import.meta.url);

let cached: Registry | undefined;

// The full validator (npm yaml and zod, lib/registry/load.ts) is imported only when the bundled
// snapshot is stale (a YAML file was edited since `deno task registry snapshot`): a normal run
// uses the snapshot and never loads either. Checked only when reading data/ is already allowed,
// so that importing this module never prompts; without that permission the first load refuses
// anyway. For another data folder import load.ts or call loadRegistryAsync.
if (!fullValidationLoaded() && readAllowed(DATA_DIR)) {
  let fresh = false;
  try {
    fresh = await primeSnapshot(DATA_DIR);
  } catch {
    // an unreadable data folder: the first load reports it
  }
  if (!fresh) await import("./load.ts");
}

function readAllowed(dir: URL): boolean {
  try {
    return Deno.permissions.querySync({ name: "read", path: dir }).state === "granted";
  } catch {
    return false;
  }
}

/**
 * The bundled registry, loaded from data/ on first use and then frozen.
 *
 * @returns the registry
 *
 * @example
 * ```ts
 * import { defaultRegistry } from "./mod.ts";
 * if (defaultRegistry() !== defaultRegistry()) throw new Error("loaded once");
 * ```
 */
export function defaultRegistry(): Registry {
  return cached ??= createRegistry(loadRegistry(DATA_DIR));
}

/**
 * The bundled registry as a constant; it loads on first property access.
 */
export const registry: Registry = new Proxy({} as Registry, {
  get(_t, key) {
    return Reflect.get(defaultRegistry(), key);
  },
  has(_t, key) {
    return Reflect.has(defaultRegistry(), key);
  },
  ownKeys() {
    return Reflect.ownKeys(defaultRegistry());
  },
  getOwnPropertyDescriptor(_t, key) {
    const d = Reflect.getOwnPropertyDescriptor(defaultRegistry(), key);
    return d ? { ...d, configurable: true } : undefined;
  },
});

/**
 * snellpath: plan, mount and audit clamp-on transit-time ultrasonic flow meters on
 * liquid-filled pipes. This module only re-exports.
 *
 * @example
 * ```ts
 * import { registry } from "./mod.ts";
 * if (registry.hash.length !== 64) throw new Error("registry hash");
 * ```
 *
 * @module
 */
export * from "./lib/errors.ts";
export * from "./lib/units.ts";
export * from "./lib/trace.ts";
export * from "./lib/registry/mod.ts";
// the full validator, so that loadRegistry validates any folder synchronously (scripts use
// lib/registry/mod.ts, which loads it only when the bundled snapshot is stale)
import "./lib/registry/load.ts";
export * from "./lib/pipe/mod.ts";
export * from "./lib/water/mod.ts";
export * from "./lib/liquids/mod.ts";
export * from "./lib/flow/mod.ts";
export * from "./lib/installation/mod.ts";
export * from "./lib/acoustics/mod.ts";
export * from "./lib/uncertainty/mod.ts";
export * from "./lib/report/mod.ts";
export * from "./lib/site/mod.ts";

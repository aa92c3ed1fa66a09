/**
 * Liquids other than pure water: seawater (TEOS-10 75-term and Gibbs function, UNESCO 1983) and
 * the registry liquids of data/liquids.yaml, behind one lookup, {@link liquidProperties}.
 * Re-exports only.
 *
 * @example
 * ```ts
 * import { liquidProperties, seawater } from "./mod.ts";
 * if (!(seawater.soundSpeed(35, 283.15) > 1480)) throw new Error();
 * if (!(liquidProperties("toluene", 298.15).density > 850)) throw new Error();
 * ```
 *
 * @module
 */
export {
  type LiquidInfo,
  type LiquidOptions,
  liquidProperties,
  liquids,
  liquidSoundSpeed,
  type LiquidState,
  liquidVapourPressure,
} from "./properties.ts";
export {
  seawater,
  type SeawaterFormulation,
  seawaterFormulations,
  type SeawaterNamespace,
  seawaterTrace,
  soundSpeed75 as seawaterSoundSpeed75,
  specificVolume75 as seawaterSpecificVolume75,
  UPS as SEAWATER_UPS,
} from "./seawater.ts";
export {
  conservativeTemperature,
  densityGibbs as seawaterDensityGibbs,
  type GibbsDerivatives,
  gibbsSeawater,
  potentialTemperature,
  soundSpeedGibbs as seawaterSoundSpeedGibbs,
} from "./gibbs.ts";
export { soundSpeedUnesco1983 } from "./unesco.ts";
export {
  apiToDensity,
  batzleWangDensity,
  batzleWangSoundSpeed,
  batzleWangViscosity,
  waltherViscosity,
} from "./petroleum.ts";
export {
  SEAWATER_VERIFICATION_FORMULATIONS,
  type SeawaterCheck,
  verifySeawaterTable,
} from "./verify.ts";

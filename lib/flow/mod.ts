/**
 * Fully developed pipe flow: Reynolds number, Darcy friction factor, velocity profiles,
 * profile factor and multi-chord weights. Re-exports only.
 *
 * @example
 * ```ts
 * import { profileFactor, reynoldsNumber } from "./mod.ts";
 * const re = reynoldsNumber(1, 0.1, 1e-6);
 * if (!(profileFactor(re) > 0.9 && profileFactor(re) < 0.96)) throw new Error();
 * ```
 *
 * @module
 */
export { type FlowRegime, reynoldsNumber } from "./reynolds.ts";
export { frictionFactor, frictionFactorExplicit, type FrictionMethod } from "./friction.ts";
export {
  type ChordRule,
  type ChordWeights,
  chordWeights,
  gaussLegendre,
  type HalfChordRule,
  halfChordRule,
} from "./quadrature.ts";
export {
  chordMeanVelocity,
  flowRegime,
  powerLawExponent,
  powerLawExponentFromFriction,
  profileFactor,
  type ProfileFactorEstimate,
  profileFactorEstimate,
  type ProfileFactorRange,
  profileFactorRange,
  type ProfileModel,
  type ProfileOptions,
  type ProfileShape,
  profileShape,
  profileVelocity,
  TURBULENT_MODELS,
} from "./profile.ts";
export { type FlowConstants, flowConstants } from "./constants.ts";

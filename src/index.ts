/**
 * exactdraw: exact random variate generation from log-densities.
 *
 * @packageDocumentation
 */
export type { Uniform, Target, SamplerStats, Sampler, SamplerOptions, OwnedStream, Proposal } from './core/types.js';
export {
  ExactDrawError,
  InvalidTargetError,
  InvalidOptionError,
  NonFiniteDensityError,
  ShapeViolationError,
  EnvelopeViolationError,
  ImproperDensityError,
  StalledSamplerError,
} from './core/errors.js';
export type { ExactDrawErrorCode } from './core/errors.js';
export { mersenneTwister, restoreMersenneTwister, DEFAULT_SEED } from './random/mersenne-twister.js';
export type { MersenneTwister, MersenneTwisterState } from './random/mersenne-twister.js';
export { substream } from './random/substream.js';
export { ksCheck, KS_EXACT_MAX_N } from './checks/ks.js';
export type { CheckResult } from './checks/ks.js';
export { andersonDarlingCheck } from './checks/anderson-darling.js';
export { chiSquareCheck } from './checks/chi-square.js';
export type { ChiSquareResult } from './checks/chi-square.js';
export { findLogBound, BOUND_MARGIN_ABSOLUTE, BOUND_MARGIN_RELATIVE } from './bounds/find-log-bound.js';
export type { FindLogBoundOptions, LogBound } from './bounds/find-log-bound.js';
export { rejectionSampler, ENVELOPE_TOLERANCE } from './methods/rejection.js';
export type { RejectionOptions, RejectionSampler } from './methods/rejection.js';
export type { SurvivalTarget, FamilyTarget } from './targets/family-target.js';
export { normalTarget } from './targets/normal.js';
export { gammaTarget, GAMMA_SERIES_MIN_SHAPE } from './targets/gamma.js';
export { betaTarget } from './targets/beta.js';
export { studentTTarget } from './targets/student-t.js';
export { logisticTarget } from './targets/logistic.js';
export { truncate } from './targets/truncate.js';
export type { TruncatedTarget } from './targets/truncate.js';
export { uniformProposal } from './proposals/uniform.js';
export { normalProposal } from './proposals/normal.js';
export { exponentialProposal } from './proposals/exponential.js';
export { cauchyProposal } from './proposals/cauchy.js';
export { ratioOfUniformsSampler } from './methods/ratio-of-uniforms.js';
export type { RatioOfUniformsOptions, RatioOfUniformsRegion, RatioOfUniformsSampler } from './methods/ratio-of-uniforms.js';
export { partitionedFill, partRange } from './random/partition.js';
export { adaptiveRejectionSampler, DEFAULT_MAX_PIECES } from './methods/adaptive-rejection.js';
export type { AdaptiveRejectionOptions, AdaptiveRejectionSampler } from './methods/adaptive-rejection.js';
export { conditionalSampler } from './methods/conditional.js';
export type { ConditionalSampler, ConditionalSamplerOptions, ConditionalSamplerStats } from './methods/conditional.js';
export { evaluateEnvelope } from './methods/envelope/description.js';
export type { EnvelopeDescription, EnvelopePiece, EnvelopeValue } from './methods/envelope/description.js';
export type { TransformName } from './methods/envelope/transforms.js';
export { HULL_LOG_TOLERANCE_ABSOLUTE, HULL_LOG_TOLERANCE_RELATIVE } from './methods/envelope/tolerance.js';
export { envelopeSvg } from './checks/envelope-svg.js';
export type { EnvelopeSvgOptions } from './checks/envelope-svg.js';
export {
  piecewiseSampler,
  DEFAULT_TARGET_AREA_RATIO,
  DEFAULT_SCAN_POINTS,
  DEFAULT_PIECEWISE_MAX_PIECES,
  PIECEWISE_SETUP_BUDGET,
  MAX_ENVELOPE_REPAIRS,
  PIECEWISE_NOISE,
  PIECEWISE_TABLE_REPAIR_ROUNDS,
} from './methods/piecewise.js';
export type { PiecewiseOptions, PiecewiseSampler, PiecewiseStats, PiecewiseEnvelope, PiecewisePiece, PiecewiseTails, PiecewiseTableSampler } from './methods/piecewise.js';
export { exactSampler, FAST_PATH_MIN_DRAWS } from './methods/auto.js';
export type { ExactSamplerOptions, ExactSampler, ExactChoice, ExactMethod, ShapeScan, RefusedMethod, ShapeProof } from './methods/auto.js';
export { tableSampler, DEFAULT_TABLE_STRIPS, DEFAULT_TABLE_TAIL_MASS, MAX_TABLE_STRIPS } from './methods/table-sampler.js';
export type { TableSamplerOptions, TableSampler } from './methods/table-sampler.js';
export type { TableDescription } from './methods/table/describe.js';
export { certifiedSampler, DEFAULT_CERTIFIED_ACCEPTANCE, DEFAULT_CERTIFIED_MAX_CELLS, MAX_CERTIFIED_CELLS } from './methods/certified.js';
export type { CertifiedOptions, CertifiedStats, CertifiedCell, CertifiedDescription, CertifiedSampler } from './methods/certified.js';
export { formulaTarget } from './formula/formula-target.js';
export type { FormulaTarget, FormulaTargetOptions } from './formula/formula-target.js';
export type { DiscreteTarget } from './core/types.js';
export type { DiscreteSampler, DiscreteMethod, DiscreteChoice, DiscreteRefusal, ChosenDiscreteSampler, DiscreteSamplerOptions } from './discrete/types.js';
export { weightedIndexSampler } from './discrete/weighted-index.js';
export type { WeightedIndexOptions, WeightedIndexSampler } from './discrete/weighted-index.js';
export { discreteChiSquareCheck, DISCRETE_CHI_SQUARE_MIN_EXPECTED, DISCRETE_CHI_SQUARE_MAX_POINTS } from './checks/discrete-chi-square.js';
export type { DiscreteChiSquareResult, DiscreteChiSquareOptions } from './checks/discrete-chi-square.js';
export { discreteSampler, DISCRETE_TABLE_MIN_POINTS } from './discrete/discrete-sampler.js';
export { reusableDiscreteSampler } from './discrete/reusable.js';
export type { ReusableDiscreteSampler, ReusableDiscreteSamplerOptions } from './discrete/reusable.js';
export { MAX_DISCRETE_TABLE_POINTS } from './discrete/methods/table.js';
export type { DiscreteFamilyTarget } from './targets/discrete/family.js';
export { poissonTarget, POISSON_SERIES_MIN_MEAN } from './targets/discrete/poisson.js';
export { binomialTarget } from './targets/discrete/binomial.js';
export { negativeBinomialTarget } from './targets/discrete/negative-binomial.js';
export { geometricTarget } from './targets/discrete/geometric.js';
export { truncateDiscrete } from './targets/discrete/truncate.js';
export type { TruncatedDiscreteTarget } from './targets/discrete/truncate.js';
export type { PoleSide, PoleTarget } from './targets/end-distance.js';
export { exponentialTarget } from './targets/exponential.js';
export { laplaceTarget } from './targets/laplace.js';
export { weibullTarget } from './targets/weibull.js';
export { lognormalTarget } from './targets/lognormal.js';
export { chiSquareTarget, CHI_SQUARE_SERIES_MIN_DF } from './targets/chi-square.js';
export { inverseGammaTarget } from './targets/inverse-gamma.js';
export { paretoTarget } from './targets/pareto.js';
export { gumbelTarget } from './targets/gumbel.js';
export { generalizedInverseGaussianTarget } from './targets/generalized-inverse-gaussian.js';
export { poleTransform, MIN_POLE_DISTANCE, POLE_ULPS_WITHOUT_DISTANCE_FORM } from './methods/transform/change-of-variables.js';
export type { PoleTransform, PoleMap } from './methods/transform/change-of-variables.js';
export type { PoleOption, TransformedSampler } from './methods/transform/sampler.js';
export { MAX_UNREPRESENTED_MASS } from './methods/transform/detect.js';

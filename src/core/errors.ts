/**
 * Typed errors. Every error exactdraw throws is an {@link ExactDrawError}
 * with a stable `code`.
 *
 * @packageDocumentation
 */

/** Stable error codes. */
export type ExactDrawErrorCode =
  | 'INVALID_TARGET'
  | 'INVALID_OPTION'
  | 'NON_FINITE'
  | 'SHAPE_VIOLATION'
  | 'ENVELOPE_VIOLATION'
  | 'IMPROPER_DENSITY'
  | 'STALLED';

/** Base class of every error thrown by exactdraw. */
export class ExactDrawError extends Error {
  /** Stable machine-readable code. */
  declare readonly code: ExactDrawErrorCode;
  /**
   * @param code - stable error code
   * @param message - human-readable message naming the API, the parameter and the value
   */
  constructor(code: ExactDrawErrorCode, message: string) {
    super(message);
    this.code = code;
    this.name = 'ExactDrawError';
  }
}

/** Bad functions, support or options (`'INVALID_TARGET'`). */
export class InvalidTargetError extends ExactDrawError {
  /** @param message - message naming the API, the parameter and the value */
  constructor(message: string) {
    super('INVALID_TARGET', message);
    this.name = 'InvalidTargetError';
  }
}

/**
 * A bad option passed to a factory or a fill (`'INVALID_OPTION'`): an unknown
 * key, a value of the wrong type or out of range.
 *
 * @example
 * ```ts
 * import { exactSampler, normalTarget, InvalidOptionError } from 'exactdraw';
 * try { exactSampler(normalTarget(0, 1), { sed: 5 } as never); }
 * catch (e) { if (e instanceof InvalidOptionError) console.log(e.code); }
 * ```
 */
export class InvalidOptionError extends ExactDrawError {
  /** @param message - message naming the API, the option and the value */
  constructor(message: string) {
    super('INVALID_OPTION', message);
    this.name = 'InvalidOptionError';
  }
}

/** `logDensity` returned `NaN` or `+Infinity` (`'NON_FINITE'`). */
export class NonFiniteDensityError extends ExactDrawError {
  /** Point at which the density was evaluated. */
  declare readonly x: number;
  /** The offending value. */
  declare readonly value: number;
  /**
   * @param api - API that evaluated the density
   * @param x - evaluation point
   * @param value - value returned by `logDensity`
   */
  constructor(api: string, x: number, value: number) {
    super('NON_FINITE', `${api}: logDensity(${x}) returned ${value}; it must be finite or -Infinity`);
    this.name = 'NonFiniteDensityError';
    this.x = x;
    this.value = value;
  }
}

/** The target does not have the shape the method needs (`'SHAPE_VIOLATION'`). */
export class ShapeViolationError extends ExactDrawError {
  /** Interval where the violation was seen, when known. */
  declare readonly interval: readonly [number, number] | undefined;
  /**
   * @param message - message naming the API, the assumption and where it fails
   * @param interval - interval where the violation was seen
   */
  constructor(message: string, interval?: readonly [number, number]) {
    super('SHAPE_VIOLATION', message);
    this.name = 'ShapeViolationError';
    this.interval = interval;
  }
}

/** The target was found above the envelope at `x` (`'ENVELOPE_VIOLATION'`). */
export class EnvelopeViolationError extends ExactDrawError {
  /** Point of the violation. */
  declare readonly x: number;
  /** Log of the target at `x`. */
  declare readonly logTarget: number;
  /** Log of the envelope (or of the squeeze, for a squeeze violation) at `x`. */
  declare readonly logEnvelope: number;
  /**
   * @param api - API that found the violation
   * @param x - point of the violation
   * @param logTarget - log of the target at x
   * @param logEnvelope - log of the envelope (or squeeze) at x
   * @param what - `'envelope'` or `'squeeze'`
   */
  constructor(api: string, x: number, logTarget: number, logEnvelope: number, what: 'envelope' | 'squeeze' = 'envelope') {
    const rel = what === 'envelope' ? 'above the envelope' : 'below the squeeze';
    super(
      'ENVELOPE_VIOLATION',
      `${api}: target is ${rel} at x = ${x}: log target = ${logTarget}, log ${what} = ${logEnvelope}; draws from this ${what} would be biased`,
    );
    this.name = 'EnvelopeViolationError';
    this.x = x;
    this.logTarget = logTarget;
    this.logEnvelope = logEnvelope;
  }
}

/** The target's mass is infinite or its tails do not decay (`'IMPROPER_DENSITY'`). */
export class ImproperDensityError extends ExactDrawError {
  /** @param message - message naming the API and the tail */
  constructor(message: string) {
    super('IMPROPER_DENSITY', message);
    this.name = 'ImproperDensityError';
  }
}

/** Too many consecutive rejections (`'STALLED'`); the message carries the acceptance figures. */
export class StalledSamplerError extends ExactDrawError {
  /** Consecutive rejections before giving up. */
  declare readonly rejections: number;
  /**
   * @param api - API that stalled
   * @param rejections - consecutive rejections
   * @param samples - draws returned so far
   * @param proposals - proposals made so far
   */
  constructor(api: string, rejections: number, samples: number, proposals: number) {
    const rate = proposals > 0 ? samples / proposals : 0;
    super(
      'STALLED',
      `${api}: ${rejections} consecutive rejections, the limit options.maxRejections (samples = ${samples}, proposals = ${proposals}, acceptance rate = ${rate}); the envelope is far too loose or the target has almost no mass where the proposal puts it (raise options.maxRejections only if a low acceptance rate is expected)`,
    );
    this.name = 'StalledSamplerError';
    this.rejections = rejections;
  }
}

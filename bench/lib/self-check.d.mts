/** Default tolerance of the self-check: 10 %. */
export declare const SELF_CHECK_TOLERANCE: number;
/** Median of a non-empty list of finite numbers (throws otherwise). */
export declare function median(values: ArrayLike<number>): number;
/** Result of {@link selfCheck}. */
export interface SelfCheckResult {
  ok: boolean;
  harnessNs: number;
  aloneNs: number;
  ratio: number;
  /** True when the two lists were compared pair by pair. */
  paired: boolean;
  tolerance: number;
  line: string;
}
/** Compares the harness's raw-uniform timings with the same loop alone in a fresh process. */
export declare function selfCheck(harnessNs: ArrayLike<number>, aloneNs: ArrayLike<number>, tolerance?: number): SelfCheckResult;

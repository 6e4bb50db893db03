/**
 * The `@stdlib` generators that the built-in benchmark suite times as peers,
 * in one module (bundled by the build like `stdlib.ts`; see there). CLI only. @internal
 *
 * @packageDocumentation
 */
import zigguratImpl from '@stdlib/random-base-improved-ziggurat';
import gammaImpl from '@stdlib/random-base-gamma';

/** A generator closure of an @stdlib random-base package. @internal */
export type PeerGenerator = () => number;

/** `@stdlib/random-base-improved-ziggurat` standard normal generator on a given uniform source. @internal */
export const zigguratFactory: (options: { prng: () => number }) => PeerGenerator = (options) =>
  (zigguratImpl.factory as unknown as (o: { prng: () => number }) => PeerGenerator)(options);

/** `@stdlib/random-base-gamma` gamma(shape, rate) generator on a given uniform source. @internal */
export const gammaFactory: (shape: number, rate: number, options: { prng: () => number }) => PeerGenerator = (shape, rate, options) =>
  (gammaImpl.factory as unknown as (a: number, b: number, o: { prng: () => number }) => PeerGenerator)(shape, rate, options);

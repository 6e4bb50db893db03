/**
 * Validation of user-supplied proposals. @internal
 *
 * @packageDocumentation
 */
import { InvalidTargetError } from './errors.js';
import { InvalidOptionError } from './errors.js';
import type { Proposal } from './types.js';
import { checkSupport } from './validate.js';

/** Validates a proposal object and returns its support. @internal */
export function checkProposal(api: string, proposal: Proposal | undefined): [number, number] {
  if (proposal === null || typeof proposal !== 'object') {
    throw new InvalidOptionError(`${api}: options.proposal must be a Proposal object (e.g. normalProposal(0, 1)), got ${proposal === null ? 'null' : typeof proposal}`);
  }
  if (typeof proposal.sample !== 'function') {
    throw new InvalidOptionError(`${api}: options.proposal.sample must be a function, got ${typeof proposal.sample}`);
  }
  if (typeof proposal.logDensity !== 'function') {
    throw new InvalidOptionError(`${api}: options.proposal.logDensity must be a function, got ${typeof proposal.logDensity}`);
  }
  return checkSupport(api, 'options.proposal.support', proposal.support ?? [-Infinity, Infinity]);
}

/** Throws unless the proposal's support covers the target's. @internal */
export function checkCovers(api: string, target: readonly [number, number], proposal: readonly [number, number]): void {
  if (proposal[0] > target[0] || proposal[1] < target[1]) {
    throw new InvalidTargetError(
      `${api}: the proposal's support [${proposal[0]}, ${proposal[1]}] does not cover the target's support [${target[0]}, ${target[1]}]; ` +
        'the uncovered part would never be drawn (truncate the target or pick a wider proposal)',
    );
  }
}

/**
 * `sample` and `fill` of a strip table. @internal
 *
 * @packageDocumentation
 */
import type { Counters } from '../../core/counters.js';
import { wrapDraws } from '../../core/draws.js';
import type { Draws } from '../../core/draws.js';
import type { Uniform } from '../../core/types.js';
import { UniformBlock } from '../../random/uniform-block.js';
import type { AliasCells } from './alias.js';
import { tableFill } from './kernel.js';
import type { TableState } from './kernel.js';
import type { StripTable } from './strip-table.js';

/**
 * `sample` and `fill` of a table (either builder): the sampler's own MT19937
 * (from `seed`) is read in blocks, an injected uniform one value at a time;
 * after-failure behaviour of {@link wrapDraws}.
 * @internal
 */
export function tableDraws(
  api: string,
  table: StripTable,
  cells: AliasCells,
  logDensity: (x: number) => number,
  counters: Counters,
  uniform: Uniform,
  ownsUniform: boolean,
  maxRejections: number,
): Draws {
  const blk = UniformBlock.of(uniform, ownsUniform);
  const st: TableState = { table, cells, logDensity, accepted: false };
  return wrapDraws(api, (out, n) => tableFill(st, out, n, counters, blk, maxRejections));
}

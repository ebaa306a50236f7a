/**
 * Suggested moves
 * ===============
 * A module whose edge weight to one other service is larger than its weight to its own service
 * is suggested to move there; `share` is the weight to that service over the module's whole
 * weight. Ties between target services go to the first in service order; a tie with the own
 * service is no suggestion. The unassigned service is never a target (modules in it can be
 * suggested into a real service). Sorted by share, largest first, then by module id.
 */
import type { SuggestedMove } from './CarvePlan';
import type { CarveIndex } from './prepareCarve';

const percent = (x: number) => `${Math.round(x * 100)}%`;
const amount = (x: number) => String(Math.round(x * 100) / 100);

/** Moves for the partition `serviceOf` (a service index per module slot) with service names `services`. */
export function suggestMoves(index: CarveIndex, serviceOf: Int32Array, services: readonly string[], unassigned: number): SuggestedMove[] {
  const weightTo = new Float64Array(services.length);
  const seenBy = new Int32Array(services.length).fill(-1);
  const touched: number[] = [];
  const moves: SuggestedMove[] = [];
  for (let m = 0; m < index.moduleIds.length; m++) {
    const own = serviceOf[m];
    let total = 0;
    touched.length = 0;
    for (let k = index.adjStart[m]; k < index.adjStart[m + 1]; k++) {
      const s = serviceOf[index.adjModule[k]];
      if (seenBy[s] !== m) {
        seenBy[s] = m;
        weightTo[s] = 0;
        touched.push(s);
      }
      weightTo[s] += index.adjWeight[k];
      total += index.adjWeight[k];
    }
    const ownWeight = seenBy[own] === m ? weightTo[own] : 0;
    let best = -1;
    for (const s of touched) {
      if (s === own || s === unassigned) continue;
      if (best === -1 || weightTo[s] > weightTo[best] || (weightTo[s] === weightTo[best] && s < best)) best = s;
    }
    if (best === -1 || !(weightTo[best] > ownWeight)) continue;
    const share = weightTo[best] / total;
    moves.push({
      module: index.moduleIds[m],
      from: services[own],
      to: services[best],
      reason: `${percent(share)} of its weight goes to ${services[best]} (${amount(weightTo[best])} of ${amount(total)}); ${percent(ownWeight / total)} stays in ${services[own]}`,
      share,
    });
  }
  return moves.sort((a, b) => b.share - a.share || (a.module < b.module ? -1 : a.module > b.module ? 1 : 0));
}

/**
 * The Pareto list of the options that meet the target, on two costs to keep low: the purchase cost
 * and the losses. Pareto dominance: a dominates b when a.cost ≤ b.cost and a.loss ≤ b.loss with one
 * of them strictly lower. The list holds every option no other dominates, one of each set of equal
 * options (the first met), ordered cheapest first or lowest losses first. Sorted scan: after sorting
 * by (cost, loss), an option is on the front exactly when its loss is below every loss before it.
 */
export interface Costed {
  cost: number;
  lossW: number;
}

/** The non-dominated options (see the header), in the order asked. */
export function paretoFront<T extends Costed>(options: readonly T[], order: 'cost' | 'losses' = 'cost'): T[] {
  const byCost = [...options].sort((a, b) => a.cost - b.cost || a.lossW - b.lossW);
  const front: T[] = [];
  let best = Infinity;
  for (const o of byCost) {
    if (o.lossW < best) {
      front.push(o);
      best = o.lossW;
    }
  }
  // The front by cost ascending has losses descending: the other order is the same list reversed.
  return order === 'cost' ? front : front.reverse();
}

/** a dominates b (see the header). */
export function dominates(a: Costed, b: Costed): boolean {
  return a.cost <= b.cost && a.lossW <= b.lossW && (a.cost < b.cost || a.lossW < b.lossW);
}

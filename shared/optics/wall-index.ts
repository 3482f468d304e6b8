import RBush from 'rbush';
import type { Wall } from './walls';

type Entry = { minX: number; minY: number; maxX: number; maxY: number; index: number };

/**
 * R-tree over the plan boxes of a list of walls (rbush, bulk-loaded). Built once per walls array
 * and kept while the array lives: the project evaluation hands the same array to every
 * placement, and a drag re-evaluates with it. A walls array is therefore never changed in place
 * once it has been traced (make a new one).
 */
const trees = new WeakMap<readonly Wall[], RBush<Entry>>();

function treeOf(walls: readonly Wall[]): RBush<Entry> {
  let tree = trees.get(walls);
  if (!tree) {
    tree = new RBush<Entry>();
    tree.load(
      walls.map((w, index) => ({
        minX: Math.min(w.aM[0], w.bM[0]),
        minY: Math.min(w.aM[1], w.bM[1]),
        maxX: Math.max(w.aM[0], w.bM[0]),
        maxY: Math.max(w.aM[1], w.bM[1]),
        index,
      })),
    );
    trees.set(walls, tree);
  }
  return tree;
}

/** Indices (ascending) of the walls whose plan box meets the box [x0, x1] × [y0, y1]. */
export function wallsInBox(walls: readonly Wall[], x0: number, y0: number, x1: number, y1: number): number[] {
  if (walls.length === 0) return [];
  // Below a few dozen walls a scan is as fast as the tree and needs no memory.
  if (walls.length < 32) {
    const out: number[] = [];
    walls.forEach((w, i) => {
      if (
        Math.max(w.aM[0], w.bM[0]) >= x0 &&
        Math.min(w.aM[0], w.bM[0]) <= x1 &&
        Math.max(w.aM[1], w.bM[1]) >= y0 &&
        Math.min(w.aM[1], w.bM[1]) <= y1
      )
        out.push(i);
    });
    return out;
  }
  return treeOf(walls)
    .search({ minX: x0, minY: y0, maxX: x1, maxY: y1 })
    .map((e) => e.index)
    .sort((a, b) => a - b);
}

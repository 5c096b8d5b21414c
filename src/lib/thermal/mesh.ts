// vertex-centred mesh of the layered wall: nodes on both surfaces and on every interface,
// so each cell lies inside one material and the conductance between nodes is k/dx of one cell
import type { Layer, MeshOptions } from './types.ts';

export const DEFAULT_MAX_CELL_SIZE = 0.005;
export const DEFAULT_MIN_CELLS_PER_LAYER = 4;

/** the discretised wall; node 0 is the outside surface, node cells is the inside surface */
export interface Mesh {
  /** number of cells (= nodes − 1) */
  cells: number;
  /** node positions from the outside face, m (length cells + 1) */
  x: Float64Array;
  /** per cell: width dx, m */
  width: Float64Array;
  /** per cell: conductance k/dx, W/m²K */
  conductance: Float64Array;
  /** per node: heat capacity lumped from the half-cells on each side, J/m²K */
  capacity: Float64Array;
  /** per layer: index of the first node; interface j (between layers j and j+1) is node layerStart[j + 1] */
  layerStart: Int32Array;
}

/** cells the mesh rule gives one layer */
export function cellsForLayer(layer: Pick<Layer, 'thickness' | 'cells'>, options?: MeshOptions): number {
  if (layer.cells !== undefined) return layer.cells;
  const maxCellSize = options?.maxCellSize ?? DEFAULT_MAX_CELL_SIZE;
  const minCells = options?.minCellsPerLayer ?? DEFAULT_MIN_CELLS_PER_LAYER;
  // the small relative slack keeps 0.1/0.005 from becoming 21 through round-off
  return Math.max(minCells, Math.ceil(layer.thickness / maxCellSize - 1e-9));
}

/** total cells the mesh rule gives the wall */
export function countCells(layers: ReadonlyArray<Pick<Layer, 'thickness' | 'cells'>>, options?: MeshOptions): number {
  let n = 0;
  for (const layer of layers) n += cellsForLayer(layer, options);
  return n;
}

/** builds the mesh: uniform cells within each layer */
export function buildMesh(layers: readonly Layer[], options?: MeshOptions): Mesh {
  const perLayer = layers.map((l) => cellsForLayer(l, options));
  const cells = perLayer.reduce((a, b) => a + b, 0);
  const x = new Float64Array(cells + 1);
  const width = new Float64Array(cells);
  const conductance = new Float64Array(cells);
  const capacity = new Float64Array(cells + 1);
  const layerStart = new Int32Array(layers.length + 1);
  let c = 0;
  let x0 = 0;
  for (let j = 0; j < layers.length; j++) {
    const l = layers[j];
    const n = perLayer[j];
    const dx = l.thickness / n;
    const rc = l.density * l.specificHeat;
    layerStart[j] = c;
    for (let i = 0; i < n; i++, c++) {
      width[c] = dx;
      conductance[c] = l.conductivity / dx;
      x[c] = x0 + i * dx;
      capacity[c] += 0.5 * rc * dx;
      capacity[c + 1] += 0.5 * rc * dx;
    }
    x0 += l.thickness;
  }
  x[cells] = x0;
  layerStart[layers.length] = cells;
  return { cells, x, width, conductance, capacity, layerStart };
}

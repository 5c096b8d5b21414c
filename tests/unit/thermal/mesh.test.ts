import { describe, expect, it } from 'vitest';
import { buildMesh, cellsForLayer, countCells } from '../../../src/lib/thermal/mesh.ts';
import { layer } from './helpers.ts';

describe('cellsForLayer', () => {
  it('uses ceil(thickness / maxCellSize) without round-off adding a cell', () => {
    expect(cellsForLayer({ thickness: 0.1 })).toBe(20);
    expect(cellsForLayer({ thickness: 0.101 })).toBe(21);
  });

  it('keeps at least minCellsPerLayer cells and honours a layer’s own cells', () => {
    expect(cellsForLayer({ thickness: 0.001 })).toBe(4);
    expect(cellsForLayer({ thickness: 0.001 }, { minCellsPerLayer: 2 })).toBe(2);
    expect(cellsForLayer({ thickness: 0.3, cells: 7 })).toBe(7);
  });
});

describe('buildMesh', () => {
  const layers = [layer('a', 0.012, 0.7, 1600, 1000), layer('b', 0.1, 0.035, 100, 1000), layer('c', 0.2, 0.77, 1700, 800, 10)];
  const mesh = buildMesh(layers);

  it('puts nodes on both surfaces and on every interface', () => {
    expect(mesh.cells).toBe(4 + 20 + 10);
    expect(countCells(layers)).toBe(mesh.cells);
    expect(mesh.x[0]).toBe(0);
    expect(mesh.x[mesh.cells]).toBeCloseTo(0.312, 14);
    expect(mesh.x[mesh.layerStart[1]]).toBeCloseTo(0.012, 14);
    expect(mesh.x[mesh.layerStart[2]]).toBeCloseTo(0.112, 14);
  });

  it('gives each cell the conductance k/dx of its own material', () => {
    expect(mesh.conductance[0]).toBeCloseTo(0.7 / 0.003, 9);
    expect(mesh.conductance[4]).toBeCloseTo(0.035 / 0.005, 9);
    expect(mesh.conductance[24]).toBeCloseTo(0.77 / 0.02, 9);
  });

  it('sums the series resistance of the cells to Σ d/λ', () => {
    let r = 0;
    for (const g of mesh.conductance) r += 1 / g;
    expect(r).toBeCloseTo(0.012 / 0.7 + 0.1 / 0.035 + 0.2 / 0.77, 12);
  });

  it('lumps half-cell capacities onto nodes so they add up to Σ ρcd', () => {
    let c = 0;
    for (const v of mesh.capacity) c += v;
    expect(c).toBeCloseTo(1600 * 1000 * 0.012 + 100 * 1000 * 0.1 + 1700 * 800 * 0.2, 6);
    // an interface node holds half a cell of each neighbour
    expect(mesh.capacity[4]).toBeCloseTo(0.5 * 1600 * 1000 * 0.003 + 0.5 * 100 * 1000 * 0.005, 9);
  });
});

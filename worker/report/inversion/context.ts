/**
 * What every section of the inversion report receives: the document and input, and the result
 * unpacked once into typed arrays (NaN in the air), the ground surface, the coverage threshold
 * and a rasterised model for the iso-velocity depths (air filled from the ground below, as the
 * model rasteriser fills it, so shared/model/iso-depth reads it as it reads any model).
 */
import { nodeX, type Grid } from '../../../shared/grid';
import { evalPolyline, type RasterModel } from '../../../shared/model';
import { airFilled, doiBetweenColumns } from '../../../shared/model/resolved-iso-depth';
import { PageFlow } from '../context';
import { inversionHeadingText, type InversionSectionKey } from './outline';
import { DEFAULT_COVERAGE_THRESHOLD, type InversionReportInput, type NodeValues } from './types';

/** Node values as Float32 with NaN for air (null). */
export function nodeFloats(values: NodeValues): Float32Array {
  return Float32Array.from({ length: values.length }, (_, i) => values[i] ?? Number.NaN);
}

export class InversionContext extends PageFlow<InversionSectionKey> {
  readonly grid: Grid;
  /** Final velocity, m/s; NaN in the air. */
  readonly velocity: Float32Array;
  readonly active: Uint8Array;
  /** Summed ray length per node, m; NaN in the air. */
  readonly coverage: Float32Array;
  /** DOI elevation per column, m; NaN where no ray passes. */
  readonly doi: Float64Array;
  readonly threshold: number;
  readonly surfaceZ: (x: number) => number;
  /** Ground surface over the grid's extent, x, z pairs. */
  readonly ground: number[];
  readonly raster: RasterModel;

  constructor(
    doc: PDFKit.PDFDocument,
    readonly input: InversionReportInput,
  ) {
    super(doc);
    const inv = input.inversion;
    const grid = (this.grid = { ...inv.grid });
    this.velocity = nodeFloats(inv.velocity);
    this.active = Uint8Array.from(this.velocity, (v) => (Number.isNaN(v) ? 0 : 1));
    this.coverage = nodeFloats(inv.coverage);
    this.doi = Float64Array.from({ length: grid.nx }, (_, i) => inv.doi[i] ?? Number.NaN);
    this.threshold = input.coverageThreshold ?? DEFAULT_COVERAGE_THRESHOLD;
    const surface = inv.surface;
    this.surfaceZ = surface ? (x: number) => evalPolyline(surface, x) : () => grid.z0;
    // The surface's own vertices inside the grid plus both ends, so the line drawn is exactly the surface.
    const x1 = nodeX(grid, grid.nx - 1);
    const xs = [grid.x0, ...(surface ?? []).map((p) => p[0]).filter((x) => x > grid.x0 && x < x1), x1];
    this.ground = xs.flatMap((x) => [x, this.surfaceZ(x)]);
    this.raster = { grid, velocity: airFilled(grid, this.velocity), active: this.active, surfaceZ: this.surfaceZ };
  }

  headingText(key: InversionSectionKey): string {
    return inversionHeadingText(key, this.input);
  }

  /** Whether a ground node has at least the threshold of ray length. */
  covered(i: number): boolean {
    return this.active[i] === 1 && this.coverage[i] >= this.threshold;
  }

  /** DOI elevation at x, linear between columns; NaN where either column has no ray. */
  doiAt(x: number): number {
    return doiBetweenColumns(this.grid, this.doi, x);
  }

  get xRange(): { min: number; max: number } {
    return { min: this.grid.x0, max: nodeX(this.grid, this.grid.nx - 1) };
  }
}

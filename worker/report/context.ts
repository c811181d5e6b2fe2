/**
 * What every section drawer receives: the document, the input, the rasterised model (computed
 * once), a flowing cursor and running numbers for sections, figures and tables.
 */
import { rasteriseModel, type RasterModel } from '../../shared/model';
import type { ReportInput } from './types';
import { CONTENT } from './style';

export class ReportContext {
  readonly model: RasterModel;
  /** Flow position on the current page (pt from the top). */
  y: number = CONTENT.top;
  private figures = 0;
  private tables = 0;

  constructor(
    readonly doc: PDFKit.PDFDocument,
    readonly input: ReportInput,
  ) {
    this.model = rasteriseModel(input.model.file);
  }

  nextFigure(): number {
    return ++this.figures;
  }
  nextTable(): number {
    return ++this.tables;
  }

  newPage(): void {
    this.doc.addPage();
    this.y = CONTENT.top;
  }

  /** Starts a new page unless `height` more points fit below the cursor. */
  ensureSpace(height: number): void {
    if (this.y + height > CONTENT.bottom) this.newPage();
  }

  get spaceLeft(): number {
    return CONTENT.bottom - this.y;
  }
}

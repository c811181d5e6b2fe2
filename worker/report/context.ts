/**
 * What every section drawer receives. `PageFlow` is the page machinery any report shares: the
 * document, a flowing cursor, running numbers for figures and tables, and the heading text of a
 * section key. `ReportContext` adds a forward run's input and its rasterised model (computed once).
 */
import { rasteriseModel, type RasterModel } from '../../shared/model';
import { sectionHeadingText, type SectionKey } from './outline';
import type { ReportInput } from './types';
import { CONTENT } from './style';

export abstract class PageFlow<K extends string = string> {
  /** Flow position on the current page (pt from the top). */
  y: number = CONTENT.top;
  private figures = 0;
  private tables = 0;

  constructor(readonly doc: PDFKit.PDFDocument) {}

  /** "2  Velocity section": the numbered heading of a section of this report. */
  abstract headingText(key: K): string;

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

export class ReportContext extends PageFlow<SectionKey> {
  readonly model: RasterModel;

  constructor(
    doc: PDFKit.PDFDocument,
    readonly input: ReportInput,
  ) {
    super(doc);
    this.model = rasteriseModel(input.model.file);
  }

  headingText(key: SectionKey): string {
    return sectionHeadingText(key, this.input);
  }
}

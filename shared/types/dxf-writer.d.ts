/** The part of the dxf-writer package Timefield uses (the package ships no types). */
declare module 'dxf-writer' {
  type HAlign = 'left' | 'center' | 'right';
  type VAlign = 'baseline' | 'bottom' | 'middle' | 'top';
  class Drawing {
    static ACI: { LAYER: 0; RED: 1; YELLOW: 2; GREEN: 3; CYAN: 4; BLUE: 5; MAGENTA: 6; WHITE: 7 };
    setUnits(unit: 'Meters' | 'Unitless'): this;
    addLayer(name: string, colorNumber: number, lineTypeName: string): this;
    setActiveLayer(name: string): this;
    setTrueColor(color: number): this;
    drawLine(x1: number, y1: number, x2: number, y2: number): this;
    drawPoint(x: number, y: number): this;
    drawCircle(x: number, y: number, r: number): this;
    drawRect(x1: number, y1: number, x2: number, y2: number): this;
    drawPolyline(points: [number, number][], closed?: boolean): this;
    drawText(x: number, y: number, height: number, rotation: number, value: string, hAlign?: HAlign, vAlign?: VAlign): this;
    toDxfString(): string;
  }
  export default Drawing;
}

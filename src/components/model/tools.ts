/** The section's tools: shape interfaces, paint with a brush or a rectangle, or erase paint. */
export type Tool = 'shape' | 'brush' | 'rect' | 'erase';

export const TOOLS: { key: Tool; label: string; hint: string }[] = [
  { key: 'shape', label: 'Shape', hint: 'Drag interface nodes; double-click a boundary to add a node; click a shot to preview it' },
  { key: 'brush', label: 'Brush', hint: 'Paint cells with the velocity below' },
  { key: 'rect', label: 'Rectangle', hint: 'Drag a rectangle to paint it with the velocity below' },
  { key: 'erase', label: 'Eraser', hint: 'Remove paint: cells go back to their layer velocity' },
];

/** Typical velocities for painted features (m/s), from memory; adjust to the site. */
export const PAINT_PRESETS: { label: string; v: number }[] = [
  { label: 'Boulder or core stone', v: 4000 },
  { label: 'Low-velocity pocket', v: 300 },
  { label: 'Buried channel fill', v: 600 },
  { label: 'Saturated sand', v: 1600 },
];

/** Page geometry, type sizes and colours of the report: A4 portrait, calm and printable. */
export const PAGE = { width: 595.28, height: 841.89 } as const;
export const MARGIN = { left: 58, right: 58, top: 62, bottom: 72 } as const;
export const CONTENT = {
  left: MARGIN.left,
  right: PAGE.width - MARGIN.right,
  width: PAGE.width - MARGIN.left - MARGIN.right,
  top: MARGIN.top,
  bottom: PAGE.height - MARGIN.bottom,
} as const;

export const SIZE = {
  title: 24,
  subtitle: 13,
  heading: 14,
  subheading: 10.5,
  body: 9.5,
  table: 8.5,
  caption: 8.5,
  tick: 7.5,
  small: 7.5,
  footer: 7.5,
} as const;

export const COLOUR = {
  ink: '#1f2a30',
  muted: '#5d6a73',
  rule: '#c5ccd1',
  faint: '#eef1f3',
  accent: '#2c5a78',
  ray: '#a23b2a',
  shot: '#d04a1e',
  interface: '#3b3b3b',
  excluded: '#8c969d',
  missing: '#f1f3f4',
} as const;

/** Space between blocks (pt). */
export const GAP = { paragraph: 6, block: 14, afterHeading: 8 } as const;

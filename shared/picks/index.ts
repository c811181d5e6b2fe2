/** Pick files (FORMATS.md §2): streaming CSV parser, cross-row rules, grouping by shot. */
export { createPickParser, parsePickText, formatPickError, type PickParser, type PickParserOptions } from './parser';
export { groupPicksByShot, type ShotPicks } from './group';
export { PickSetTracker, atSource, type PickSetConflict } from './pick-set';
export { PICK_COLUMNS, REQUIRED_PICK_COLUMNS, type PickColumn } from './columns';
export type { Pick, ShotSummary, PickError, PickParseResult } from './types';
export { placeShots, type PlacedShot, type PlacementResult } from './placement';

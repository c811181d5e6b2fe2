/** Pure helpers behind the velocity model editor (see README.md). */
export { createHistory, pushState, replacePresent, commitFrom, undo, redo, canUndo, canRedo, DEFAULT_HISTORY_LIMIT, type History } from './history';
export { nearestNode, brushCells, brushStrokeCells, rectangleCells, paintCells, eraseCells, type XZ } from './paint';
export { moveNode, insertNode, insertNodeInWidestGap, deleteNode, canDeleteNode, fitPolylineToRange, midline, MIN_NODE_GAP, type Point } from './polyline-edit';
export { addLayerBelow, removeLayer, updateLayer, layerTop } from './layers-edit';
export { gridFromSpec, specFromGrid, checkGridSpec, type GridSpec } from './grid-spec';
export { defaultModel, defaultGridSpec, stationSurface, type LineGeometry } from './defaults';
export { regridModel, resampleEdits, type RegridResult } from './regrid';
export { formatGridCsv, parseGridCsv, float32Text, GRID_CSV_HEADER, type GridCsvError, type GridCsvResult } from './grid-csv';
export { checkDraft, gridIsUsable, interfacesInsideGrid, type DraftCheck } from './check-draft';
export { formatModelFile } from './model-text';

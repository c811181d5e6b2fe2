export { parseBoreholeCsv, type BoreholeCsvResult, type BoreholeFileIssue } from './csv';
export { groundAt } from './ground';
export { boreholeTies } from './ties';
export { deepestInterfaceDepth, deepestLayerName, depthBetween } from './surfaces';

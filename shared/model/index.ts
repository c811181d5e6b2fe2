/** Velocity models: parse/validate "timefield-model/1" files and rasterise them onto their grid. */
export { parseModelFile, formatModelIssues, type ModelPathIssue, type ParseModelResult } from './parse';
export { rasteriseModel, type RasterModel } from './rasterise';
export { evalPolyline, type Polyline } from './polyline';
export { checkModelRules, formatJsonPath, type ModelIssue } from './rules';
export type { ModelFile, ModelLayer, ModelEdit, ModelGrid } from '../schemas/model';

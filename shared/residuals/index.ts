/** Residuals (observed − computed) and misfit statistics per run, shot and receiver. Seconds inside. */
export { residualOf, computeResiduals, type Residual, type ResidualInput } from './compute';
export {
  residualStats, statsByShot, statsByReceiver, runStats,
  type ResidualStats, type ShotStats, type ReceiverStats, type RunStats,
} from './stats';
export { RESIDUAL_CSV_HEADER, residualCsvRow, formatResidualCsv } from './csv';

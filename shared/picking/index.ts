export { pickTrace, isDead, qualityOf, sigmaOf, type PickerOptions, type PickOutcome, type TracePick } from './pick-trace';
export { energyRatio, quietestEnergy, triggers } from './energy-ratio';
export { aicOnset } from './aic';

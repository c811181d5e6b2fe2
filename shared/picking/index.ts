export { pickTrace, pickInWindow, isDead, qualityOf, sigmaOf, type PickerOptions, type PickOutcome, type TracePick } from './pick-trace';
export { pickGather, type GatherTrace } from './pick-gather';
export { energyRatio, quietestEnergy, triggers } from './energy-ratio';
export { aicOnset } from './aic';

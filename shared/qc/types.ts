/**
 * The light pick the QC functions read, so the client (edited picks in memory) and the server
 * (picks from the database) can both call them. SI: metres and seconds.
 */
export interface QcPick {
  /** Caller's identifier for the pick (e.g. its position in the pick set); echoed back in every result. */
  index: number;
  shotId: string;
  sourceX: number;
  receiverX: number;
  /** First-arrival time, s. */
  time: number;
  /** Pick uncertainty, s. Carried for the caller; the QC rules below do not weight by it. */
  sigma: number;
  /** Picks the user has switched off; every QC function except travelTimeCurves leaves them out. */
  excluded?: boolean;
}

/**
 * Picks made in the record view, per record and trace, with an undo history. Pure: the page keeps
 * this in a reducer, the tests drive it directly.
 */
export interface TracePickMark {
  /** After the shot (delay applied), ms. */
  timeMs: number;
  sigmaMs: number;
  how: 'auto' | 'hand';
}

export type RecordPickMarks = (TracePickMark | null)[];

export interface PickingState {
  byRecord: Readonly<Record<string, RecordPickMarks>>;
  /** Each entry restores one record as it was before a change. */
  history: { recordId: string; before: RecordPickMarks | undefined }[];
  /** Changes since the last save. */
  unsaved: number;
}

export type PickingAction =
  | { kind: 'set'; recordId: string; traces: number; trace: number; mark: TracePickMark | null }
  | { kind: 'replace'; recordId: string; marks: RecordPickMarks }
  /** Automatic picks arriving (from the picker worker): hand picks made meanwhile or before are kept. */
  | { kind: 'auto'; recordId: string; marks: RecordPickMarks }
  | { kind: 'undo' }
  | { kind: 'saved' };

export const emptyPicking: PickingState = { byRecord: {}, history: [], unsaved: 0 };

/** Enough to undo an afternoon of picking without holding every state ever. */
const HISTORY_LIMIT = 500;

export function pickingReducer(state: PickingState, action: PickingAction): PickingState {
  switch (action.kind) {
    case 'set': {
      const before = state.byRecord[action.recordId];
      const marks = before ? [...before] : new Array<TracePickMark | null>(action.traces).fill(null);
      if (sameMark(marks[action.trace] ?? null, action.mark)) return state;
      marks[action.trace] = action.mark;
      return change(state, action.recordId, before, marks);
    }
    case 'replace':
      return change(state, action.recordId, state.byRecord[action.recordId], action.marks);
    case 'auto': {
      const before = state.byRecord[action.recordId];
      return change(state, action.recordId, before, action.marks.map((m, i) => (before?.[i]?.how === 'hand' ? before[i] : m)));
    }
    case 'undo': {
      const last = state.history[state.history.length - 1];
      if (!last) return state;
      const byRecord = { ...state.byRecord };
      if (last.before) byRecord[last.recordId] = last.before;
      else delete byRecord[last.recordId];
      return { byRecord, history: state.history.slice(0, -1), unsaved: Math.max(0, state.unsaved - 1) };
    }
    case 'saved':
      return { ...state, unsaved: 0 };
  }
}

function change(state: PickingState, recordId: string, before: RecordPickMarks | undefined, marks: RecordPickMarks): PickingState {
  const history = [...state.history, { recordId, before }].slice(-HISTORY_LIMIT);
  return { byRecord: { ...state.byRecord, [recordId]: marks }, history, unsaved: state.unsaved + 1 };
}

function sameMark(a: TracePickMark | null, b: TracePickMark | null): boolean {
  return a === b || (a !== null && b !== null && a.timeMs === b.timeMs && a.how === b.how && a.sigmaMs === b.sigmaMs);
}

export function pickCount(marks: RecordPickMarks | undefined): number {
  return marks ? marks.reduce((n, m) => n + (m ? 1 : 0), 0) : 0;
}

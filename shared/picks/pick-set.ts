/**
 * Rules that span rows (FORMATS.md §2): every pick of a shot shares one source position,
 * and a shot has at most one pick per receiver position. Used by the CSV parser and by the
 * JSON pick-set schema, so both reject the same files.
 */
import type { Pick, ShotSummary } from './types';

export interface PickSetConflict {
  column: 'source_x' | 'source_z' | 'receiver_x';
  message: string;
}

/** Picks by receiver x: the first pick itself (no extra allocation), or a list when one x has several z. */
type ReceiverIndex = Map<number, Pick | Pick[]>;
const NONE: readonly PickSetConflict[] = [];

const zText = (z: number | null): string => (z === null ? 'on the surface' : String(z));

export class PickSetTracker {
  private readonly shots = new Map<string, ShotSummary & { line: number; receivers: ReceiverIndex }>();

  /** `unit` names what Pick.line counts in messages: file lines (CSV) or rows (JSON). */
  constructor(private readonly unit: 'line' | 'row' = 'line') {}

  /** Records the pick and returns what it conflicts with (empty when it fits). */
  add(p: Pick): readonly PickSetConflict[] {
    let conflicts: PickSetConflict[] | null = null;
    let shot = this.shots.get(p.shotId);
    if (!shot) {
      shot = { shotId: p.shotId, sourceX: p.sourceX, sourceZ: p.sourceZ, picks: 1, line: p.line, receivers: new Map() };
      this.shots.set(p.shotId, shot);
    } else {
      shot.picks++;
      if (shot.sourceX !== p.sourceX) {
        (conflicts ??= []).push({ column: 'source_x', message: `shot ${p.shotId} has source_x = ${shot.sourceX} on ${this.unit} ${shot.line} but ${p.sourceX} here; all picks of a shot share one source position` });
      }
      if (shot.sourceZ !== p.sourceZ) {
        (conflicts ??= []).push({ column: 'source_z', message: `shot ${p.shotId} has source_z ${zText(shot.sourceZ)} on ${this.unit} ${shot.line} but ${zText(p.sourceZ)} here; all picks of a shot share one source position` });
      }
    }
    // Receivers keyed by x (a number key, no string building), then by z.
    const prev = shot.receivers.get(p.receiverX);
    if (prev === undefined) {
      shot.receivers.set(p.receiverX, p);
    } else {
      const list = Array.isArray(prev) ? prev : [prev];
      const first = list.find((q) => q.receiverZ === p.receiverZ);
      if (first) {
        (conflicts ??= []).push({ column: 'receiver_x', message: `shot ${p.shotId} already has a pick at receiver_x = ${p.receiverX}, receiver_z ${zText(p.receiverZ)} (${this.unit} ${first.line}); duplicate pick` });
      } else {
        list.push(p);
        if (list !== prev) shot.receivers.set(p.receiverX, list);
      }
    }
    return conflicts ?? NONE;
  }

  /** Shots in order of first appearance. */
  summaries(): ShotSummary[] {
    return [...this.shots.values()].map(({ shotId, sourceX, sourceZ, picks }) => ({ shotId, sourceX, sourceZ, picks }));
  }
}

/** FORMATS.md §2: a zero time is allowed only for a pick at the source position itself. */
export const atSource = (p: Pick): boolean => p.receiverX === p.sourceX && p.receiverZ === p.sourceZ;

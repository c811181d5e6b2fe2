import { useState, type KeyboardEvent } from 'react';
import { divergingColor } from './divergingColor';
import type { Matrix } from './matrix';

interface MisfitGridProps<T> {
  matrix: Matrix<T>;
  valueOf: (item: T) => number;
  excludedOf?: (item: T) => boolean;
  /** Words for one cell, read by screen readers and shown on hover. */
  describe: (item: T) => string;
  limit: number;
  selected: T | null;
  onSelect: (item: T) => void;
  label: string;
  testId?: string;
}

const HATCH = 'repeating-linear-gradient(45deg, #d6d3d1 0 2px, #ffffff 2px 5px)';

/**
 * Shots (rows) × receiver positions (columns), each pick a coloured cell. Keyboard: Tab reaches one
 * cell; arrows, Home and End move between picks; Enter or Space opens the pick.
 */
export function MisfitGrid<T>({ matrix, valueOf, excludedOf, describe, limit, selected, onSelect, label, testId }: MisfitGridProps<T>) {
  const { shots, receivers, cells } = matrix;
  const first = firstCell(cells);
  const [focus, setFocus] = useState<[number, number]>(first);
  const [fr, fc] = cells[focus[0]]?.[focus[1]] ? focus : first;
  const cellHeight = shots.length <= 12 ? 26 : shots.length <= 30 ? 18 : 12;
  const tickEvery = Math.max(1, Math.ceil(receivers.length / 12));

  const moveTo = (r: number, c: number) => {
    setFocus([r, c]);
    document.querySelector<HTMLElement>(`[data-grid="${testId}"] [data-cell="${r}-${c}"]`)?.focus();
  };
  const onKeyDown = (e: KeyboardEvent, r: number, c: number) => {
    const target = step(cells, r, c, e.key);
    if (!target) return;
    e.preventDefault();
    moveTo(target[0], target[1]);
  };

  return (
    <div className="overflow-x-auto">
      <div
        role="grid"
        aria-label={label}
        data-grid={testId}
        data-testid={testId}
        className="grid min-w-[36rem] gap-px bg-stone-200 p-px"
        style={{ gridTemplateColumns: `max-content repeat(${receivers.length}, minmax(6px, 1fr))` }}
      >
        {shots.map((shot, r) => (
          <div role="row" key={shot} className="contents">
            <div role="rowheader" className="bg-white px-2 text-right text-sm leading-none tabular-nums text-stone-700" style={{ lineHeight: `${cellHeight}px` }}>
              {shot}
            </div>
            {receivers.map((x, c) => {
              const item = cells[r]![c];
              if (!item) return <div role="gridcell" key={x} className="bg-white" style={{ height: cellHeight }} />;
              const excluded = excludedOf?.(item) ?? false;
              const isSelected = item === selected;
              const words = describe(item);
              return (
                <div role="gridcell" key={x} aria-selected={isSelected}>
                  <button
                    type="button"
                    data-cell={`${r}-${c}`}
                    tabIndex={r === fr && c === fc ? 0 : -1}
                    aria-label={words}
                    title={words}
                    onClick={() => {
                      setFocus([r, c]);
                      onSelect(item);
                    }}
                    onKeyDown={(e) => onKeyDown(e, r, c)}
                    className={`block w-full focus-visible:relative focus-visible:z-10 ${isSelected ? 'relative z-10 outline-2 outline-offset-0 outline-stone-900' : ''}`}
                    style={{ height: cellHeight, background: excluded ? HATCH : (divergingColor(valueOf(item), limit) ?? '#ffffff') }}
                  />
                </div>
              );
            })}
          </div>
        ))}
        <div role="row" className="contents">
          <div role="columnheader" className="bg-white px-2 text-right text-xs text-stone-600">
            x (m)
          </div>
          {receivers.map((x, c) =>
            c % tickEvery === 0 ? (
              <div role="columnheader" key={x} className="bg-white pt-0.5 text-xs tabular-nums text-stone-600" style={{ gridColumn: `span ${Math.min(tickEvery, receivers.length - c)}` }}>
                {Number(x.toFixed(2))}
              </div>
            ) : null,
          )}
        </div>
      </div>
    </div>
  );
}

function firstCell<T>(cells: (T | null)[][]): [number, number] {
  for (let r = 0; r < cells.length; r++) for (let c = 0; c < cells[r]!.length; c++) if (cells[r]![c]) return [r, c];
  return [0, 0];
}

/** The next non-empty cell in the key's direction, or null (key not ours, or nothing there). */
function step<T>(cells: (T | null)[][], r: number, c: number, key: string): [number, number] | null {
  const rows = cells.length;
  const cols = cells[0]?.length ?? 0;
  const has = (rr: number, cc: number) => Boolean(cells[rr]?.[cc]);
  const scan = (dr: number, dc: number): [number, number] | null => {
    for (let rr = r + dr, cc = c + dc; rr >= 0 && rr < rows && cc >= 0 && cc < cols; rr += dr, cc += dc) if (has(rr, cc)) return [rr, cc];
    return null;
  };
  switch (key) {
    case 'ArrowRight':
      return scan(0, 1);
    case 'ArrowLeft':
      return scan(0, -1);
    case 'ArrowDown':
      return scan(1, 0);
    case 'ArrowUp':
      return scan(-1, 0);
    case 'Home':
      for (let cc = 0; cc < cols; cc++) if (has(r, cc)) return [r, cc];
      return null;
    case 'End':
      for (let cc = cols - 1; cc >= 0; cc--) if (has(r, cc)) return [r, cc];
      return null;
    default:
      return null;
  }
}

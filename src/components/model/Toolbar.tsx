/** Tools, paint settings, undo/redo, the colour range and the vertical exaggeration, in one row above the section. */
import type { ReactNode } from 'react';
import { Button } from '../Button';
import { NumberInput } from './NumberInput';
import { EXAGGERATIONS } from './sectionGeometry';
import { PAINT_PRESETS, TOOLS, type Tool } from './tools';

export interface ToolbarProps {
  tool: Tool;
  onTool: (t: Tool) => void;
  paintV: number;
  onPaintV: (v: number) => void;
  brushRadius: number;
  onBrushRadius: (r: number) => void;
  canUndo: boolean;
  canRedo: boolean;
  onUndo: () => void;
  onRedo: () => void;
  exaggeration: number;
  onExaggeration: (e: number) => void;
  readOnly: boolean;
  paintInvalid?: string;
  /** The velocity colour control, beside the exaggeration. */
  colours?: ReactNode;
}

export function Toolbar(p: ToolbarProps) {
  const painting = p.tool === 'brush' || p.tool === 'rect';
  return (
    <div data-testid="toolbar" className="mb-3 flex flex-wrap items-end gap-x-5 gap-y-3">
      {!p.readOnly && (
        <div role="radiogroup" aria-label="Tool" className="flex overflow-hidden rounded-md border border-stone-300 bg-white">
          {TOOLS.map((t) => (
            <button
              key={t.key}
              type="button"
              role="radio"
              aria-checked={p.tool === t.key}
              title={t.hint}
              data-testid={`tool-${t.key}`}
              onClick={() => p.onTool(t.key)}
              className={`border-r border-stone-300 px-3 py-1.5 text-sm font-semibold last:border-r-0 ${p.tool === t.key ? 'bg-accent-700 text-white' : 'text-stone-800 hover:bg-stone-50'}`}
            >
              {t.label}
            </button>
          ))}
        </div>
      )}
      {!p.readOnly && (painting || p.tool === 'erase') && (
        <div className="flex flex-wrap items-end gap-3">
          {painting && (
            <>
              <label className="flex flex-col text-sm font-semibold text-stone-800">
                Paint velocity (m/s)
                <NumberInput aria-label="Paint velocity (m/s)" value={p.paintV} invalid={p.paintInvalid} onCommit={p.onPaintV} />
              </label>
              <label className="flex flex-col text-sm font-semibold text-stone-800">
                Typical
                <select
                  aria-label="Typical velocity for a painted feature"
                  value=""
                  onChange={(e) => e.target.value && p.onPaintV(Number(e.target.value))}
                  className="rounded-md border border-stone-300 bg-white px-2 py-1 font-normal"
                >
                  <option value="">choose…</option>
                  {PAINT_PRESETS.map((pr) => (
                    <option key={pr.label} value={pr.v}>
                      {pr.label} ({pr.v} m/s)
                    </option>
                  ))}
                </select>
              </label>
            </>
          )}
          {p.tool !== 'rect' && (
            <label className="flex flex-col text-sm font-semibold text-stone-800">
              Brush radius (m)
              <NumberInput aria-label="Brush radius (m)" value={p.brushRadius} onCommit={(r) => Number.isFinite(r) && r >= 0 && p.onBrushRadius(r)} />
            </label>
          )}
        </div>
      )}
      {!p.readOnly && (
        <div className="flex gap-2">
          <Button size="sm" variant="secondary" disabled={!p.canUndo} onClick={p.onUndo} title="Undo (Ctrl+Z)" data-testid="undo">
            Undo
          </Button>
          <Button size="sm" variant="secondary" disabled={!p.canRedo} onClick={p.onRedo} title="Redo (Ctrl+Shift+Z)" data-testid="redo">
            Redo
          </Button>
        </div>
      )}
      <div className="ml-auto flex flex-wrap items-end gap-x-5 gap-y-3">
        {p.colours}
        <label className="flex flex-col text-sm font-semibold text-stone-800">
          Vertical exaggeration
          <select
            data-testid="exaggeration"
            value={p.exaggeration}
            onChange={(e) => p.onExaggeration(Number(e.target.value))}
            className="rounded-md border border-stone-300 bg-white px-2 py-1 font-normal"
          >
            {EXAGGERATIONS.map((e) => (
              <option key={e} value={e}>
                {e}×
              </option>
            ))}
          </select>
        </label>
      </div>
    </div>
  );
}

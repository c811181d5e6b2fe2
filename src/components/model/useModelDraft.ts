/**
 * The draft model and its undo/redo history. Every change is a step; a drag or a brush stroke is
 * one step however many moves it has (begin → transient… → end). Ctrl+Z undoes and Ctrl+Shift+Z
 * (or Ctrl+Y) redoes anywhere on the page except inside a text field, where the browser's own
 * text undo applies.
 */
import { useCallback, useEffect, useRef, useState } from 'react';
import type { ModelFile } from '../../../shared/model';
import { canRedo, canUndo, commitFrom, createHistory, pushState, redo, replacePresent, undo } from '../../../shared/model/edit';

type Change = (m: ModelFile) => ModelFile;

export function useModelDraft(initial: ModelFile, readOnly: boolean) {
  const [history, setHistory] = useState(() => createHistory(initial));
  /** performance.now() of the latest change, for the preview's edit → redraw timing. */
  const editedAt = useRef(performance.now());
  const present = useRef(history.present);
  present.current = history.present;
  const anchor = useRef<ModelFile | null>(null);

  const touch = () => {
    editedAt.current = performance.now();
  };
  const commit = useCallback((change: Change) => {
    touch();
    setHistory((h) => pushState(h, change(h.present)));
  }, []);
  const transient = useCallback((change: Change) => {
    touch();
    setHistory((h) => replacePresent(h, change(h.present)));
  }, []);
  const begin = useCallback(() => {
    anchor.current = present.current;
  }, []);
  const end = useCallback(() => {
    const a = anchor.current;
    anchor.current = null;
    if (a) setHistory((h) => commitFrom(h, a));
  }, []);
  const doUndo = useCallback(() => {
    touch();
    setHistory(undo);
  }, []);
  const doRedo = useCallback(() => {
    touch();
    setHistory(redo);
  }, []);

  useEffect(() => {
    if (readOnly) return;
    const onKey = (e: KeyboardEvent) => {
      if (!(e.ctrlKey || e.metaKey) || e.altKey) return;
      const t = e.target as HTMLElement | null;
      if (t && (t.isContentEditable || (['INPUT', 'TEXTAREA', 'SELECT'].includes(t.tagName) && (t as HTMLInputElement).type !== 'checkbox'))) return;
      const key = e.key.toLowerCase();
      if (key === 'z' && !e.shiftKey) {
        e.preventDefault();
        doUndo();
      } else if ((key === 'z' && e.shiftKey) || key === 'y') {
        e.preventDefault();
        doRedo();
      }
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [readOnly, doUndo, doRedo]);

  return {
    draft: history.present,
    commit,
    transient,
    begin,
    end,
    undo: doUndo,
    redo: doRedo,
    canUndo: canUndo(history),
    canRedo: canRedo(history),
    editedAt,
  };
}

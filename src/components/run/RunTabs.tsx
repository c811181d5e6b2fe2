import { useRef, type KeyboardEvent, type ReactNode } from 'react';

export interface RunTab<K extends string> {
  key: K;
  label: string;
}

/** Tabs for the result views; Left/Right/Home/End move between them (the usual tab pattern). */
export function RunTabs<K extends string>({ tabs, selected, onSelect, idPrefix }: { tabs: RunTab<K>[]; selected: K; onSelect: (key: K) => void; idPrefix: string }) {
  const list = useRef<HTMLDivElement>(null);
  const onKeyDown = (e: KeyboardEvent) => {
    const i = tabs.findIndex((t) => t.key === selected);
    const next = e.key === 'ArrowRight' ? i + 1 : e.key === 'ArrowLeft' ? i - 1 : e.key === 'Home' ? 0 : e.key === 'End' ? tabs.length - 1 : null;
    if (next === null) return;
    e.preventDefault();
    const tab = tabs[(next + tabs.length) % tabs.length]!;
    onSelect(tab.key);
    list.current?.querySelector<HTMLElement>(`#${idPrefix}-tab-${tab.key}`)?.focus();
  };
  return (
    <div ref={list} role="tablist" aria-label="Result views" onKeyDown={onKeyDown} className="mb-5 flex flex-wrap gap-1 border-b border-stone-300">
      {tabs.map((t) => {
        const on = t.key === selected;
        return (
          <button
            key={t.key}
            id={`${idPrefix}-tab-${t.key}`}
            type="button"
            role="tab"
            aria-selected={on}
            aria-controls={`${idPrefix}-panel`}
            tabIndex={on ? 0 : -1}
            data-testid={`run-tab-${t.key}`}
            onClick={() => onSelect(t.key)}
            className={`-mb-px rounded-t-md border px-4 py-2 font-semibold ${
              on ? 'border-stone-300 border-b-(--color-paper) bg-(--color-paper) text-stone-900' : 'border-transparent text-stone-600 hover:text-stone-900'
            }`}
          >
            {t.label}
          </button>
        );
      })}
    </div>
  );
}

export function RunTabPanel({ idPrefix, tabKey, children }: { idPrefix: string; tabKey: string; children: ReactNode }) {
  return (
    <div id={`${idPrefix}-panel`} role="tabpanel" aria-labelledby={`${idPrefix}-tab-${tabKey}`} tabIndex={0} className="focus-visible:outline-offset-4">
      {children}
    </div>
  );
}

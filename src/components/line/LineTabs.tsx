import { useEffect, useRef, type KeyboardEvent, type ReactNode } from 'react';

export interface TabDef<K extends string> {
  key: K;
  label: string;
  /** A short count or state shown after the label, e.g. "48". */
  badge?: ReactNode;
}

/**
 * Tabs in the WAI-ARIA pattern: one tab stop for the row, arrow keys move between tabs,
 * Home/End jump to the ends. The selected tab lives in the URL, so the caller owns it.
 */
export function LineTabs<K extends string>({ tabs, selected, onSelect, idPrefix }: { tabs: TabDef<K>[]; selected: K; onSelect: (key: K) => void; idPrefix: string }) {
  const refs = useRef<(HTMLButtonElement | null)[]>([]);
  const list = useRef<HTMLDivElement>(null);
  const selectedIndex = tabs.findIndex((t) => t.key === selected);

  // On a narrow screen the row scrolls sideways: bring the selected tab into sight (a link may open
  // the last tab), moving only the row, never the page.
  useEffect(() => {
    const row = list.current;
    const tab = refs.current[selectedIndex];
    if (!row || !tab) return;
    const left = tab.offsetLeft - row.offsetLeft;
    if (left < row.scrollLeft || left + tab.offsetWidth > row.scrollLeft + row.clientWidth) row.scrollLeft = Math.max(0, left - 16);
  }, [selectedIndex]);

  function onKeyDown(e: KeyboardEvent, i: number) {
    const last = tabs.length - 1;
    const next = e.key === 'ArrowRight' ? (i === last ? 0 : i + 1) : e.key === 'ArrowLeft' ? (i === 0 ? last : i - 1) : e.key === 'Home' ? 0 : e.key === 'End' ? last : -1;
    if (next < 0) return;
    e.preventDefault();
    onSelect(tabs[next].key);
    refs.current[next]?.focus();
  }

  return (
    <div ref={list} role="tablist" aria-label="Line data" className="mb-6 flex gap-1 overflow-x-auto border-b border-stone-300">
      {tabs.map((t, i) => {
        const active = t.key === selected;
        return (
          <button
            key={t.key}
            ref={(el) => {
              refs.current[i] = el;
            }}
            type="button"
            role="tab"
            id={`${idPrefix}-tab-${t.key}`}
            aria-selected={active}
            aria-controls={`${idPrefix}-panel-${t.key}`}
            tabIndex={active ? 0 : -1}
            data-testid={`tab-${t.key}`}
            onClick={() => onSelect(t.key)}
            onKeyDown={(e) => onKeyDown(e, i)}
            className={`-mb-px flex items-center gap-2 whitespace-nowrap border-b-3 px-4 py-2 font-semibold ${
              active ? 'border-accent-700 text-accent-800' : 'border-transparent text-stone-600 hover:border-stone-300 hover:text-stone-900'
            }`}
          >
            {t.label}
            {t.badge !== undefined && (
              <span className={`rounded-full px-2 text-sm tabular-nums ${active ? 'bg-accent-50 text-accent-800' : 'bg-stone-100 text-stone-600'}`}>{t.badge}</span>
            )}
          </button>
        );
      })}
    </div>
  );
}

export function TabPanel({ idPrefix, tabKey, hidden, children }: { idPrefix: string; tabKey: string; hidden?: boolean; children: ReactNode }) {
  return (
    <div role="tabpanel" hidden={hidden} id={`${idPrefix}-panel-${tabKey}`} aria-labelledby={`${idPrefix}-tab-${tabKey}`} data-testid={`panel-${tabKey}`}>
      {children}
    </div>
  );
}

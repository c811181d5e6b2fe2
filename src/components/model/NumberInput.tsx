import { useEffect, useState, type InputHTMLAttributes } from 'react';

/** A number as text; the value is committed on Enter or when focus leaves, so typing "350" is one undo step, not three. */
export function NumberInput({
  value, onCommit, invalid, className = '', ...rest
}: { value: number; onCommit: (v: number) => void; invalid?: string } & Omit<InputHTMLAttributes<HTMLInputElement>, 'value' | 'onChange'>) {
  const shown = Number.isFinite(value) ? String(value) : '';
  const [text, setText] = useState(shown);
  useEffect(() => setText(shown), [shown]);
  const commit = () => {
    const n = text.trim() === '' ? Number.NaN : Number(text.trim());
    if (!Object.is(n, value)) onCommit(n);
  };
  return (
    <input
      type="text"
      inputMode="decimal"
      value={text}
      aria-invalid={invalid ? true : undefined}
      title={invalid}
      onChange={(e) => setText(e.target.value)}
      onBlur={commit}
      onKeyDown={(e) => {
        if (e.key === 'Enter') commit();
        else if (e.key === 'Escape') setText(shown);
      }}
      className={`${/\bw-\d/.test(className) ? '' : 'w-24'} rounded-md border bg-white px-2 py-1 text-right tabular-nums text-stone-900 disabled:bg-stone-100 disabled:text-stone-600 ${invalid ? 'border-red-700 bg-red-50' : 'border-stone-300 hover:border-stone-400'} ${className}`}
      {...rest}
    />
  );
}

/** Same, for text (layer names). */
export function TextInput({ value, onCommit, className = '', ...rest }: { value: string; onCommit: (v: string) => void } & Omit<InputHTMLAttributes<HTMLInputElement>, 'value' | 'onChange'>) {
  const [text, setText] = useState(value);
  useEffect(() => setText(value), [value]);
  const commit = () => {
    if (text !== value) onCommit(text);
  };
  return (
    <input
      type="text"
      value={text}
      onChange={(e) => setText(e.target.value)}
      onBlur={commit}
      onKeyDown={(e) => {
        if (e.key === 'Enter') commit();
        else if (e.key === 'Escape') setText(value);
      }}
      className={`w-full min-w-28 rounded-md border border-stone-300 bg-white px-2 py-1 text-stone-900 hover:border-stone-400 disabled:bg-stone-100 disabled:text-stone-600 ${className}`}
      {...rest}
    />
  );
}

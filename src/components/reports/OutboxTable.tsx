import { Fragment, useState } from 'react';
import type { OutboxMessage } from '../../api/types';
import { DataTable, Th } from '../Table';
import { dateTime } from './wording';

/**
 * Messages the mail sink received. A row opens with the button in its subject cell (keyboard:
 * Tab to it, Enter or Space), showing the message body in full beneath it.
 */
export function OutboxTable({ messages }: { messages: OutboxMessage[] }) {
  const [open, setOpen] = useState<Set<number>>(new Set());
  const toggle = (id: number) =>
    setOpen((prev) => {
      const next = new Set(prev);
      if (next.has(id)) next.delete(id);
      else next.add(id);
      return next;
    });

  return (
    <DataTable caption="Mail sent by Timefield, newest first" testId="outbox-table" minWidth="48rem">
      <thead>
        <tr>
          <Th>Received</Th>
          <Th>From</Th>
          <Th>To</Th>
          <Th>Subject</Th>
        </tr>
      </thead>
      <tbody>
        {messages.map((m, i) => {
          const expanded = open.has(m.id);
          const bodyId = `outbox-body-${m.id}`;
          const zebra = i % 2 === 1 ? 'bg-stone-50' : '';
          return (
            <Fragment key={m.id}>
              <tr data-testid="outbox-row" className={`border-b border-stone-200 ${zebra}`}>
                <td className="px-4 py-2.5 align-top whitespace-nowrap text-stone-700">{dateTime(m.receivedAt)}</td>
                <td className="px-4 py-2.5 align-top break-all text-stone-700">{m.from}</td>
                <td className="px-4 py-2.5 align-top">
                  <ul>
                    {m.to.map((to) => (
                      <li key={to} className="break-all">
                        {to}
                      </li>
                    ))}
                  </ul>
                </td>
                <td className="px-4 py-2.5 align-top">
                  <button
                    type="button"
                    aria-expanded={expanded}
                    aria-controls={bodyId}
                    onClick={() => toggle(m.id)}
                    className="flex items-start gap-2 text-left font-semibold text-accent-700 hover:text-accent-900"
                  >
                    <span aria-hidden="true" className={`mt-0.5 inline-block w-3 transition-transform ${expanded ? 'rotate-90' : ''}`}>
                      ▸
                    </span>
                    <span data-testid="outbox-subject">{m.subject || '(no subject)'}</span>
                  </button>
                </td>
              </tr>
              <tr id={bodyId} hidden={!expanded} className={`border-b border-stone-200 ${zebra}`}>
                <td colSpan={4} className="px-4 pb-4">
                  <pre data-testid="outbox-body" className="max-w-prose rounded-md border border-stone-200 bg-white px-4 py-3 font-sans text-[0.95rem] whitespace-pre-wrap text-stone-800">
                    {m.body || '(empty message)'}
                  </pre>
                </td>
              </tr>
            </Fragment>
          );
        })}
      </tbody>
    </DataTable>
  );
}

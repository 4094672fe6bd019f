import type { OutboxMessage } from '../../../../shared/schemas/users';
import { Badge } from '../../../components/ui/badge';
import { formatDateTime } from '../../../lib/format';

const statusTone = (status: string) => (status === 'sent' ? 'good' : status === 'failed' ? 'bad' : 'neutral');

/** The e-mails Kilowatch has queued or sent (invitations, password resets), newest first. */
export function OutboxList({ messages }: { messages: OutboxMessage[] }) {
  const sorted = [...messages].sort((a, b) => b.createdAt.localeCompare(a.createdAt));
  return (
    <ul className="flex flex-col gap-3" data-list="outbox">
      {sorted.map((m) => (
        <li key={m.id} className="rounded-plate border border-deck-200 bg-white shadow-plate" data-outbox-message={m.id}>
          <details>
            <summary className="flex cursor-pointer flex-wrap items-center justify-between gap-3 px-gutter py-3">
              <span>
                <span className="block font-semibold text-hull-900">{m.subject}</span>
                <span className="block text-caption text-hull-500">
                  to {m.toAddress} · {formatDateTime(m.createdAt)}
                </span>
              </span>
              <Badge tone={statusTone(m.status)}>{m.status}</Badge>
            </summary>
            <div className="border-t border-deck-100 px-gutter py-3">
              {m.error ? <p className="mb-2 text-small text-signal-600">Delivery error: {m.error}</p> : null}
              <pre className="whitespace-pre-wrap break-words font-sans text-small text-hull-800">{m.bodyText}</pre>
            </div>
          </details>
        </li>
      ))}
    </ul>
  );
}
